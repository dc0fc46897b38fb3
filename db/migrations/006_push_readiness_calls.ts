import type { Kysely } from "kysely";

// Reaching every device: the server's VAPID keys, each device's push subscription per band, what each
// device last reported holding (readiness for tonight), and the tunes the leader called on a gig.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("push_keys")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("public_key", "text", (c) => c.notNull())
    .addColumn("private_key", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("push_subscriptions")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("user_id", "text", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("device_id", "text", (c) => c.notNull())
    .addColumn("endpoint", "text", (c) => c.notNull())
    .addColumn("p256dh", "text", (c) => c.notNull())
    .addColumn("auth", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("last_sent_at", "text")
    .execute();
  await db.schema.createIndex("push_subscriptions_band_endpoint").unique().on("push_subscriptions").columns(["band_id", "endpoint"]).execute();
  await db.schema.createIndex("push_subscriptions_endpoint").on("push_subscriptions").column("endpoint").execute();

  await db.schema
    .createTable("device_reports")
    .addColumn("device_id", "text", (c) => c.notNull())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("user_id", "text", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("label", "text", (c) => c.notNull())
    .addColumn("cursor", "integer", (c) => c.notNull())
    .addColumn("holdings_json", "text", (c) => c.notNull())
    .addColumn("reported_at", "text", (c) => c.notNull())
    .addPrimaryKeyConstraint("device_reports_pk", ["device_id", "band_id"])
    .execute();
  await db.schema.createIndex("device_reports_band_user").on("device_reports").columns(["band_id", "user_id"]).execute();

  await db.schema
    .createTable("gig_calls")
    .addColumn("seq", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("setlist_id", "text", (c) => c.notNull())
    .addColumn("entry_id", "text", (c) => c.notNull())
    .addColumn("chart_id", "text", (c) => c.notNull())
    .addColumn("called_by", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("gig_calls_setlist_seq").on("gig_calls").columns(["setlist_id", "seq"]).execute();

  await db.schema
    .createTable("gig_callers")
    .addColumn("setlist_id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("user_id", "text", (c) => c.notNull())
    .addColumn("set_by", "text", (c) => c.notNull())
    .addColumn("set_at", "text", (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of ["gig_callers", "gig_calls", "device_reports", "push_subscriptions", "push_keys"]) {
    await db.schema.dropTable(t).ifExists().execute();
  }
}
