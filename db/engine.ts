// The few places where SQLite and PostgreSQL differ, each behind one function. Everything else in
// db/ and lib/server is plain Kysely that both dialects compile.
import { PostgresAdapter, type CreateTableBuilder, type Kysely } from "kysely";

export type Engine = "sqlite" | "postgres";

/** Which engine a Kysely instance (or transaction) talks to, read from its dialect's adapter. */
export function engineOf(db: Kysely<never> | Kysely<unknown> | { getExecutor(): { adapter: unknown } }): Engine {
  return (db as { getExecutor(): { adapter: unknown } }).getExecutor().adapter instanceof PostgresAdapter ? "postgres" : "sqlite";
}

/** True for a connection string that names a PostgreSQL server. */
export function isPostgresUrl(target: string): boolean {
  return /^postgres(ql)?:\/\//i.test(target);
}

/**
 * The change feed's `seq` column: SQLite's rowid alias (AUTOINCREMENT, so a number is never reused),
 * PostgreSQL's bigint identity backed by a sequence. Both hand out increasing numbers on insert.
 */
export function addFeedSeqColumn<T extends string>(db: Kysely<unknown>, table: CreateTableBuilder<T, never>): CreateTableBuilder<T, "seq"> {
  if (engineOf(db) === "postgres") return table.addColumn("seq", "bigint", (c) => c.primaryKey().generatedByDefaultAsIdentity());
  return table.addColumn("seq", "integer", (c) => c.primaryKey().autoIncrement());
}

/**
 * Hand-written SQL in db/ uses `?` placeholders (SQLite's); PostgreSQL numbers them `$1, $2, …`.
 * The SQL here never has a `?` inside a string literal.
 */
export function placeholders(engine: Engine, text: string): string {
  if (engine === "sqlite") return text;
  let n = 0;
  return text.replace(/\?/g, () => `$${++n}`);
}
