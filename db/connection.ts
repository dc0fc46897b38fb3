// The one place a database client is created. SQLite (WAL mode, foreign keys on) by default;
// PostgreSQL through the `pg` pool when DATABASE_URL names a postgres:// server.
import Database from "better-sqlite3";
import { CompiledQuery, Kysely, Migrator, PostgresDialect, sql, SqliteDialect, SqliteDriver, type DatabaseConnection, type Driver } from "kysely";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { engineOf, isPostgresUrl } from "./engine";
import { migrationProvider } from "./migrations";
import type { Database as Schema } from "./schema";

export function databasePath(): string {
  return process.env.DATABASE_PATH ?? path.join(process.cwd(), "data", "pedalpoint.db");
}

/** Where the app's data lives: DATABASE_URL when it names a PostgreSQL server, else the SQLite file. */
export function databaseTarget(): string {
  const url = process.env.DATABASE_URL;
  return url && isPostgresUrl(url) ? url : databasePath();
}

/** The target as people read it in logs: a PostgreSQL URL without its password. */
export function describeTarget(target = databaseTarget()): string {
  if (!isPostgresUrl(target)) return path.relative(process.cwd(), target) || target;
  const u = new URL(target);
  if (u.password) u.password = "***";
  return u.toString();
}

// The better-sqlite3 handle behind each Kysely instance, for db/ modules that keep prepared statements.
const handles = new WeakMap<Kysely<Schema>, Database.Database>();

/** The raw SQLite handle of a Kysely instance made by openDatabase (undefined for any other). */
export function sqliteHandle(db: Kysely<Schema>): Database.Database | undefined {
  return handles.get(db);
}

// The pg pool behind each PostgreSQL instance, for libraries that take a pool (rate limits).
const pools = new WeakMap<Kysely<Schema>, pg.Pool>();

/** The pg pool of a Kysely instance made by openPostgres (undefined for any other). */
export function postgresPool(db: Kysely<Schema>): pg.Pool | undefined {
  return pools.get(db);
}

// The schema a PostgreSQL instance was opened in, so its migration bookkeeping stays in it too.
const schemas = new WeakMap<Kysely<Schema>, string>();

// bigint (the feed's seq, count(*)) comes back as a JS number, like SQLite's integers: the feed
// would need 2^53 changes before that loses precision.
const INT8_OID = 20;
const types = {
  getTypeParser: ((oid: number, format?: "text" | "binary") =>
    oid === INT8_OID ? (v: string) => Number(v) : pg.types.getTypeParser(oid, format as "text")) as typeof pg.types.getTypeParser,
};

export interface PostgresOptions {
  /** Connections in this process's pool (DATABASE_POOL_SIZE, default 10). */
  poolSize?: number;
  /** Schema to work in (tests give each database its own); default the server's search_path. */
  schema?: string;
}

export function openPostgres(url: string, opts: PostgresOptions = {}): Kysely<Schema> {
  const max = opts.poolSize ?? (Number(process.env.DATABASE_POOL_SIZE) || 10);
  const pool = new pg.Pool({
    connectionString: url,
    max,
    types,
    idleTimeoutMillis: 10_000,
    ...(opts.schema ? { options: `-c search_path=${opts.schema}` } : {}),
  });
  // An idle client losing its server (a restart, a failover) must not take the process down.
  pool.on("error", (err) => console.error(`database pool: ${err.message}`));
  const db = new Kysely<Schema>({ dialect: new PostgresDialect({ pool }) });
  if (opts.schema) schemas.set(db, opts.schema);
  pools.set(db, pool);
  return db;
}

/**
 * SQLite transactions begin IMMEDIATE: they take the write lock at their start, waiting for it up to
 * busy_timeout. A plain (deferred) transaction that reads first and then writes fails at once with
 * SQLITE_BUSY_SNAPSHOT when another process wrote the file in between, which two app processes on
 * one file do all the time; waiting at the start is the fix SQLite's documentation gives.
 */
class ImmediateSqliteDriver extends SqliteDriver {
  override async beginTransaction(connection: DatabaseConnection): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw("begin immediate"));
  }
}

class ImmediateSqliteDialect extends SqliteDialect {
  constructor(private readonly settings: ConstructorParameters<typeof SqliteDialect>[0]) {
    super(settings);
  }

  override createDriver(): Driver {
    return new ImmediateSqliteDriver(this.settings);
  }
}

export function openSqlite(file: string): Kysely<Schema> {
  if (file !== ":memory:") fs.mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  const db = new Kysely<Schema>({ dialect: new ImmediateSqliteDialect({ database: sqlite }) });
  handles.set(db, sqlite);
  return db;
}

/** A SQLite file path (or ":memory:") or a postgres:// URL; default databaseTarget(). */
export function openDatabase(target = databaseTarget()): Kysely<Schema> {
  return isPostgresUrl(target) ? openPostgres(target) : openSqlite(target);
}

async function currentSchema(db: Kysely<Schema>): Promise<string> {
  const r = await sql<{ s: string }>`select current_schema() as s`.execute(db);
  return r.rows[0]?.s ?? "public";
}

export async function migrateToLatest(db: Kysely<Schema>): Promise<string[]> {
  // Kysely looks for its bookkeeping tables in every schema unless told which one is ours.
  const schema = schemas.get(db) ?? (engineOf(db) === "postgres" ? await currentSchema(db) : undefined);
  // Migrations from parallel work may land out of number order; apply whichever are missing.
  const migrator = new Migrator({
    db,
    provider: migrationProvider,
    allowUnorderedMigrations: true,
    ...(schema ? { migrationTableSchema: schema } : {}),
  });
  const { error, results } = await migrator.migrateToLatest();
  if (error) throw error instanceof Error ? error : new Error(String(error));
  return (results ?? []).filter((r) => r.status === "Success").map((r) => r.migrationName);
}
