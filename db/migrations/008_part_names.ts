import type { Kysely } from "kysely";

// PDF and image parts: the name a player knows the part by ("2nd trumpet") and the part it is for
// (an instrument id), both asked before the upload. Older parts keep null and show their file name.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable("attachments").addColumn("part_name", "text").execute();
  await db.schema.alterTable("attachments").addColumn("instrument", "text").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable("attachments").dropColumn("instrument").execute();
  await db.schema.alterTable("attachments").dropColumn("part_name").execute();
}
