import type { Kysely } from "kysely";

// Security state every app process must share:
// - rate_limits: the per-client and per-address counters (rate-limiter-flexible's own table layout:
//   key, points, expire in epoch milliseconds).
// - users.session_version: bumped to end every session of a user at once (password change, sign out
//   everywhere, removed membership); a session token carries the version it was issued with.
// - users.email_verified_at: when the address was proven (a sign-in link opened); until then a
//   password set at sign-up is not trusted over the address's real owner.
// - ended_sessions: single sessions ended by signing out, until their token would have expired.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("rate_limits")
    .addColumn("key", "varchar(255)", (c) => c.primaryKey())
    .addColumn("points", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("expire", "bigint")
    .execute();
  await db.schema.alterTable("users").addColumn("session_version", "integer", (c) => c.notNull().defaultTo(0)).execute();
  await db.schema.alterTable("users").addColumn("email_verified_at", "text").execute();
  await db.schema
    .createTable("ended_sessions")
    .addColumn("sid", "text", (c) => c.primaryKey())
    .addColumn("user_id", "text", (c) => c.notNull())
    .addColumn("ends_at", "text", (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("ended_sessions").ifExists().execute();
  await db.schema.alterTable("users").dropColumn("email_verified_at").execute();
  await db.schema.alterTable("users").dropColumn("session_version").execute();
  await db.schema.dropTable("rate_limits").ifExists().execute();
}
