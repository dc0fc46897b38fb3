// Databases for the server tests. By default each test database is a SQLite file (or ":memory:");
// when PEDALPOINT_TEST_DATABASE_URL names a PostgreSQL server (`npm run test:pg` sets it), each one
// is a fresh schema on that server instead, migrated the same way, so the same tests run on both.
import { randomBytes } from "node:crypto";
import { sql, type Kysely } from "kysely";
import { migrateToLatest, openPostgres, openSqlite } from "./connection";
import { isPostgresUrl, type Engine } from "./engine";
import type { Database } from "./schema";

/** The PostgreSQL server the tests run against, or null for SQLite. */
export function testPostgresUrl(): string | null {
  const url = process.env.PEDALPOINT_TEST_DATABASE_URL;
  return url && isPostgresUrl(url) ? url : null;
}

export function testEngine(): Engine {
  return testPostgresUrl() ? "postgres" : "sqlite";
}

let admin: Kysely<Database> | null = null;

/** A migrated, empty database: `sqliteTarget` on SQLite, a new schema on the test PostgreSQL server. */
export async function openTestDatabase(sqliteTarget: string): Promise<Kysely<Database>> {
  const url = testPostgresUrl();
  if (!url) {
    const db = openSqlite(sqliteTarget);
    await migrateToLatest(db);
    return db;
  }
  admin ??= openPostgres(url, { poolSize: 1 });
  const schema = `t_${randomBytes(6).toString("hex")}`;
  await sql`create schema ${sql.id(schema)}`.execute(admin);
  const db = openPostgres(url, { schema, poolSize: 4 });
  await migrateToLatest(db);
  return db;
}
