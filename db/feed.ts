// Appending to the change feed (`changes`), the one write whose ordering the sync protocol relies on.
// A device pulls "everything after the last seq I saw", so a seq must never become visible after a
// larger seq of the same band is already visible (docs/scale-out.md, "the change feed").
// SQLite has one writer at a time, so numbers are handed out in commit order already. PostgreSQL
// hands out sequence numbers to concurrent transactions that may commit in any order, so each
// transaction first takes its band's feed lock (a transaction-scoped advisory lock) and holds it
// until it commits: within a band, seq order is then commit order.
import { sql, type Insertable, type Kysely, type Transaction } from "kysely";
import { engineOf } from "./engine";
import type { ChangesTable, Database } from "./schema";

/** First key of the two-key advisory lock: marks the lock as the feed's (the second is the band). */
export const FEED_LOCK_CLASS = 0x5eed;

async function insert(db: Kysely<Database> | Transaction<Database>, row: Insertable<ChangesTable>): Promise<number> {
  const r = await db.insertInto("changes").values(row).returning("seq").executeTakeFirstOrThrow();
  return Number(r.seq);
}

/** Takes the band's feed lock on PostgreSQL (held to the end of the transaction); nothing on SQLite. */
export async function lockBandFeed(trx: Transaction<Database>, bandId: string): Promise<void> {
  if (engineOf(trx) !== "postgres") return;
  await sql`select pg_advisory_xact_lock(${sql.lit(FEED_LOCK_CLASS)}, hashtext(${bandId}))`.execute(trx);
}

/** Appends one change and returns its seq. Outside a transaction it makes one for the lock's sake. */
export async function appendChange(db: Kysely<Database> | Transaction<Database>, row: Insertable<ChangesTable>): Promise<number> {
  if (engineOf(db) !== "postgres") return insert(db, row);
  if (!db.isTransaction) return db.transaction().execute((trx) => appendChange(trx, row));
  await lockBandFeed(db as Transaction<Database>, row.band_id);
  return insert(db, row);
}
