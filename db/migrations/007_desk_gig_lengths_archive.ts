import type { Kysely } from "kysely";

// How long a set runs: choruses each soloist takes per tune, and the length the leader wants for each
// set (JSON array, index 0 = set 1). Archived charts: tombstoned like a delete, with a row here so a
// leader or arranger can bring them back.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable("setlist_entries").addColumn("choruses", "integer", (c) => c.notNull().defaultTo(1)).execute();
  // 1 = no intro tonight, straight in at the top, even where the chart has its own intro.
  await db.schema.alterTable("setlist_entries").addColumn("straight_in", "integer", (c) => c.notNull().defaultTo(0)).execute();
  await db.schema.alterTable("setlists").addColumn("set_minutes_json", "text", (c) => c.notNull().defaultTo("[]")).execute();
  await db.schema
    .createTable("chart_archive")
    .addColumn("chart_id", "text", (c) => c.primaryKey().references("charts.id").onDelete("cascade"))
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("archived_at", "text", (c) => c.notNull())
    .addColumn("archived_by", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("chart_archive_band").on("chart_archive").column("band_id").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("chart_archive").ifExists().execute();
  await db.schema.alterTable("setlists").dropColumn("set_minutes_json").execute();
  await db.schema.alterTable("setlist_entries").dropColumn("straight_in").execute();
  await db.schema.alterTable("setlist_entries").dropColumn("choruses").execute();
}
