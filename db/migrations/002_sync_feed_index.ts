import type { Kysely } from "kysely";

// The delta-sync feed sends each entity once, at its latest change: this index answers
// "is there a later change of this entity?" without scanning the band's whole feed.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.createIndex("changes_entity_seq").on("changes").columns(["entity", "entity_id", "seq"]).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropIndex("changes_entity_seq").ifExists().execute();
}
