import type { Kysely } from "kysely";

// A sync pull walks the band's feed by seq and, for each change, asks whether a later change of the
// same entity exists. With these two covering indexes both halves are read from the index alone,
// never from the table rows.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.createIndex("changes_band_feed").on("changes").columns(["band_id", "seq", "entity", "entity_id", "op", "user_id"]).execute();
  await db.schema.createIndex("changes_entity_latest").on("changes").columns(["entity", "entity_id", "band_id", "seq", "user_id"]).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropIndex("changes_entity_latest").ifExists().execute();
  await db.schema.dropIndex("changes_band_feed").ifExists().execute();
}
