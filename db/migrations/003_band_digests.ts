import type { Kysely } from "kysely";

// Where each band's last "charts updated" notice stopped in the change feed, so the next one
// lists only what was published after it.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("band_digests")
    .addColumn("band_id", "text", (c) => c.primaryKey().references("bands.id").onDelete("cascade"))
    .addColumn("last_seq", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("sent_at", "text", (c) => c.notNull())
    .addColumn("sent_by", "text", (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("band_digests").ifExists().execute();
}
