import type { Kysely } from "kysely";
import { addFeedSeqColumn } from "../engine";

// Plain Kysely schema builder only, so both dialects run the same migration; the feed's seq column
// is the one difference (db/engine.ts).
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("users")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("email", "text", (c) => c.notNull().unique())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("password_hash", "text")
    .addColumn("default_instrument", "text", (c) => c.notNull().defaultTo("concert"))
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("bands")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("city", "text")
    .addColumn("created_by", "text", (c) => c.notNull().references("users.id"))
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("memberships")
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("user_id", "text", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull())
    .addColumn("instrument", "text", (c) => c.notNull().defaultTo("concert"))
    .addColumn("expires_at", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .addPrimaryKeyConstraint("memberships_pk", ["band_id", "user_id"])
    .execute();
  await db.schema.createIndex("memberships_user").on("memberships").column("user_id").execute();

  await db.schema
    .createTable("invites")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("role", "text", (c) => c.notNull())
    .addColumn("instrument", "text", (c) => c.notNull().defaultTo("concert"))
    .addColumn("invited_by", "text", (c) => c.notNull().references("users.id"))
    .addColumn("expires_at", "text", (c) => c.notNull())
    .addColumn("access_expires_at", "text")
    .addColumn("accepted_at", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("charts")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("composer", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("concert_key", "text", (c) => c.notNull())
    .addColumn("meter", "text", (c) => c.notNull())
    .addColumn("tempo", "integer")
    .addColumn("feel", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("body_json", "text", (c) => c.notNull())
    .addColumn("source_text", "text", (c) => c.notNull())
    .addColumn("revision", "integer", (c) => c.notNull())
    .addColumn("updated_by", "text", (c) => c.notNull().references("users.id"))
    .addColumn("updated_at", "text", (c) => c.notNull())
    .addColumn("deleted_at", "text")
    .execute();
  await db.schema.createIndex("charts_band").on("charts").column("band_id").execute();

  await db.schema
    .createTable("chart_revisions")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("chart_id", "text", (c) => c.notNull().references("charts.id").onDelete("cascade"))
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("revision", "integer", (c) => c.notNull())
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("body_json", "text", (c) => c.notNull())
    .addColumn("source_text", "text", (c) => c.notNull())
    .addColumn("meta_json", "text", (c) => c.notNull())
    .addColumn("message", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("author_id", "text", (c) => c.notNull().references("users.id"))
    .addColumn("created_at", "text", (c) => c.notNull())
    .addUniqueConstraint("chart_revisions_unique", ["chart_id", "revision"])
    .execute();

  await db.schema
    .createTable("setlists")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("starts_at", "text")
    .addColumn("venue", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("revision", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("updated_by", "text", (c) => c.notNull())
    .addColumn("updated_at", "text", (c) => c.notNull())
    .addColumn("deleted_at", "text")
    .execute();

  await db.schema
    .createTable("setlist_entries")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("setlist_id", "text", (c) => c.notNull().references("setlists.id").onDelete("cascade"))
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("set_number", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("chart_id", "text", (c) => c.notNull().references("charts.id"))
    .addColumn("key", "text")
    .addColumn("intro_json", "text")
    .addColumn("ending", "text")
    .addColumn("tempo", "integer")
    .addColumn("solo_order", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .execute();
  await db.schema.createIndex("setlist_entries_setlist").on("setlist_entries").column("setlist_id").execute();

  await db.schema
    .createTable("annotations")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("user_id", "text", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("chart_id", "text", (c) => c.notNull().references("charts.id").onDelete("cascade"))
    .addColumn("data_json", "text", (c) => c.notNull())
    .addColumn("revision", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("updated_at", "text", (c) => c.notNull())
    .addColumn("deleted_at", "text")
    .execute();

  await db.schema
    .createTable("attachments")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("chart_id", "text", (c) => c.notNull().references("charts.id").onDelete("cascade"))
    .addColumn("filename", "text", (c) => c.notNull())
    .addColumn("path", "text", (c) => c.notNull())
    .addColumn("sha256", "text", (c) => c.notNull())
    .addColumn("size", "integer", (c) => c.notNull())
    .addColumn("type", "text", (c) => c.notNull())
    .addColumn("pages", "integer")
    .addColumn("uploaded_by", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("deleted_at", "text")
    .execute();

  await db.schema
    .createTable("shares")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull().references("bands.id").onDelete("cascade"))
    .addColumn("setlist_id", "text", (c) => c.notNull().references("setlists.id").onDelete("cascade"))
    .addColumn("user_id", "text")
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("expires_at", "text", (c) => c.notNull())
    .addColumn("created_by", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .addColumn("revoked_at", "text")
    .execute();

  await addFeedSeqColumn(db, db.schema.createTable("changes"))
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("entity", "text", (c) => c.notNull())
    .addColumn("entity_id", "text", (c) => c.notNull())
    .addColumn("op", "text", (c) => c.notNull())
    .addColumn("user_id", "text")
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("changes_band_seq").on("changes").columns(["band_id", "seq"]).execute();

  await db.schema
    .createTable("applied_mutations")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("band_id", "text", (c) => c.notNull())
    .addColumn("user_id", "text", (c) => c.notNull())
    .addColumn("result_json", "text", (c) => c.notNull())
    .addColumn("created_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("subscriptions")
    .addColumn("band_id", "text", (c) => c.primaryKey().references("bands.id").onDelete("cascade"))
    .addColumn("plan", "text", (c) => c.notNull().defaultTo("free"))
    .addColumn("status", "text", (c) => c.notNull().defaultTo("active"))
    .addColumn("customer_id", "text")
    .addColumn("subscription_id", "text")
    .addColumn("current_period_end", "text")
    .addColumn("cancel_at_period_end", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("login_attempts")
    .addColumn("key", "text", (c) => c.primaryKey())
    .addColumn("failures", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("locked_until", "text")
    .addColumn("updated_at", "text", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("sign_in_tokens")
    .addColumn("token_hash", "text", (c) => c.primaryKey())
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("expires_at", "text", (c) => c.notNull())
    .addColumn("used_at", "text")
    .execute();

}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of [
    "sign_in_tokens", "login_attempts", "subscriptions", "applied_mutations", "changes", "shares",
    "attachments", "annotations", "setlist_entries", "setlists", "chart_revisions", "charts",
    "invites", "memberships", "bands", "users",
  ]) {
    await db.schema.dropTable(t).ifExists().execute();
  }
}
