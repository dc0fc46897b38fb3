// `npm run db:copy -- --from sqlite:data/pedalpoint.db --to postgres://user@host/db`
// Copies every table of the app (users, bands, charts and their revisions, set lists, shares, marks,
// the change feed, parts' rows, …) from one database to another, in an order that keeps foreign keys
// whole, into a target migrated to the same version. Then checks, table by table, that the row
// counts and a sha256 checksum of the rows match. The parts' rows are copied; their bytes stay where
// they are (the data folder or the object store, both addressed by the same sha256 keys).
// The target's tables must be empty (a fresh database): nothing there is overwritten.
import { sql, type Kysely } from "kysely";
import { parseArgs } from "node:util";
import { migrateToLatest, openDatabase } from "../db/connection";
import { engineOf } from "../db/engine";
import type { Database } from "../db/schema";

// Parents before children; tables not named here (added later) follow in name order.
const ORDER = [
  "users", "bands", "memberships", "invites", "charts", "chart_revisions", "setlists", "setlist_entries",
  "annotations", "attachments", "shares", "changes", "applied_mutations", "subscriptions", "login_attempts",
  "sign_in_tokens", "band_digests",
];
const BATCH = 200;

type AnyDb = Kysely<Record<string, Record<string, unknown>>>;

function target(arg: string): string {
  return arg.startsWith("sqlite:") ? arg.slice("sqlite:".length) : arg;
}

async function tablesOf(db: AnyDb): Promise<string[]> {
  const names = (await db.introspection.getTables()).map((t) => t.name).filter((n) => !n.startsWith("kysely_"));
  const known = ORDER.filter((t) => names.includes(t));
  return [...known, ...names.filter((n) => !ORDER.includes(n)).sort()];
}

/** Rows as canonical text: columns by name, numbers as numbers, so both engines give the same text. */
function canonical(row: Record<string, unknown>): string {
  const keys = Object.keys(row).sort();
  return JSON.stringify(keys.map((k) => {
    const v = row[k];
    return typeof v === "bigint" ? Number(v) : v;
  }));
}

async function checksum(db: AnyDb, table: string): Promise<{ count: number; sum: string }> {
  const { createHash } = await import("node:crypto");
  const rows = (await db.selectFrom(table).selectAll().execute()).map(canonical).sort();
  const h = createHash("sha256");
  for (const r of rows) h.update(r).update("\n");
  return { count: rows.length, sum: h.digest("hex") };
}

async function copyTable(from: AnyDb, to: AnyDb, table: string): Promise<number> {
  const rows = await from.selectFrom(table).selectAll().execute();
  for (let i = 0; i < rows.length; i += BATCH) await to.insertInto(table).values(rows.slice(i, i + BATCH)).execute();
  return rows.length;
}

async function main(): Promise<number> {
  const { values } = parseArgs({ options: { from: { type: "string" }, to: { type: "string" } } });
  if (!values.from || !values.to) {
    console.error("usage: npm run db:copy -- --from sqlite:data/pedalpoint.db --to postgres://user@host:5432/db");
    return 2;
  }
  const from = openDatabase(target(values.from)) as Kysely<Database>;
  const to = openDatabase(target(values.to)) as Kysely<Database>;
  try {
    await migrateToLatest(from);
    await migrateToLatest(to);
    const src = from as unknown as AnyDb;
    const dst = to as unknown as AnyDb;
    const tables = await tablesOf(src);
    for (const t of tables) {
      const n = await dst.selectFrom(t).select(sql<number>`count(*)`.as("n")).executeTakeFirstOrThrow();
      if (Number(n.n) > 0) throw new Error(`the target's ${t} table is not empty: copy into a fresh database`);
    }
    await dst.transaction().execute(async (trx) => {
      for (const t of tables) console.log(`${t}: ${await copyTable(src, trx as unknown as AnyDb, t)} rows`);
      // The feed's sequence carries on after the copied numbers.
      if (engineOf(to) === "postgres") await sql`select setval(pg_get_serial_sequence('changes', 'seq'), greatest(coalesce(max(seq), 0), 1)) from changes`.execute(trx);
    });
    let bad = 0;
    for (const t of tables) {
      const [a, b] = [await checksum(src, t), await checksum(dst, t)];
      const ok = a.count === b.count && a.sum === b.sum;
      if (!ok) bad++;
      console.log(`${ok ? "ok  " : "DIFF"} ${t}: ${a.count} → ${b.count} rows, sha256 ${a.sum.slice(0, 16)} ${ok ? "=" : "≠"} ${b.sum.slice(0, 16)}`);
    }
    console.log(bad ? `${bad} table(s) differ` : `copied and checked ${tables.length} tables`);
    return bad ? 1 : 0;
  } finally {
    await from.destroy();
    await to.destroy();
  }
}

process.exit(await main());
