import "server-only";
// The app's shared database handle, created lazily once per server process.
import type { Kysely } from "kysely";
import { migrateToLatest, openDatabase } from "./connection";
import type { Database } from "./schema";

const globalForDb = globalThis as unknown as { pedalpointDb?: Kysely<Database>; pedalpointMigrated?: Promise<void> };

export function getDb(): Kysely<Database> {
  globalForDb.pedalpointDb ??= openDatabase();
  return globalForDb.pedalpointDb;
}

/** Resolves once migrations have run in this process. */
export function ready(): Promise<Kysely<Database>> {
  const db = getDb();
  globalForDb.pedalpointMigrated ??= migrateToLatest(db).then(() => undefined);
  return globalForDb.pedalpointMigrated.then(() => db);
}
