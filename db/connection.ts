// The one place a database client is created. WAL mode and foreign keys on.
import Database from "better-sqlite3";
import { Kysely, Migrator, SqliteDialect } from "kysely";
import fs from "node:fs";
import path from "node:path";
import { migrationProvider } from "./migrations";
import type { Database as Schema } from "./schema";

export function databasePath(): string {
  return process.env.DATABASE_PATH ?? path.join(process.cwd(), "data", "pedalpoint.db");
}

// The better-sqlite3 handle behind each Kysely instance, for db/ modules that keep prepared statements.
const handles = new WeakMap<Kysely<Schema>, Database.Database>();

/** The raw SQLite handle of a Kysely instance made by openDatabase (undefined for any other). */
export function sqliteHandle(db: Kysely<Schema>): Database.Database | undefined {
  return handles.get(db);
}

export function openDatabase(file = databasePath()): Kysely<Schema> {
  if (file !== ":memory:") fs.mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  const db = new Kysely<Schema>({ dialect: new SqliteDialect({ database: sqlite }) });
  handles.set(db, sqlite);
  return db;
}

export async function migrateToLatest(db: Kysely<Schema>): Promise<string[]> {
  // Migrations from parallel work may land out of number order; apply whichever are missing.
  const migrator = new Migrator({ db, provider: migrationProvider, allowUnorderedMigrations: true });
  const { error, results } = await migrator.migrateToLatest();
  if (error) throw error instanceof Error ? error : new Error(String(error));
  return (results ?? []).filter((r) => r.status === "Success").map((r) => r.migrationName);
}
