import "server-only";
// The hot reads of a sync pull, as fixed SQL kept prepared once per database handle.
// A pull makes the same handful of queries on every request; building them with Kysely and having
// better-sqlite3 prepare them each time cost more than running them. Each read still takes
// Kysely's connection lock, so it never runs inside another request's open transaction.
import type BetterSqlite3 from "better-sqlite3";
import { CompiledQuery, type Kysely } from "kysely";
import { sqliteHandle } from "./connection";
import { engineOf, placeholders } from "./engine";
import type { Database, Membership } from "./schema";

const prepared = new WeakMap<BetterSqlite3.Database, Map<string, BetterSqlite3.Statement>>();

/**
 * Runs `sql` as a prepared statement. With `shape`, rows come from better-sqlite3 as plain arrays
 * and are made into objects here: for wide rows that is much cheaper than its own object building.
 */
async function all<T>(db: Kysely<Database>, sql: string, params: readonly unknown[], shape?: (row: unknown[]) => T): Promise<T[]> {
  const handle = sqliteHandle(db);
  if (!handle) {
    // PostgreSQL (or any other dialect): the same SQL through Kysely, placeholders numbered for it.
    const rows = (await db.executeQuery<T>(CompiledQuery.raw(placeholders(engineOf(db), sql), [...params]))).rows as T[];
    return shape ? rows.map((r) => shape(Object.values(r as object))) : rows;
  }
  let cache = prepared.get(handle);
  if (!cache) prepared.set(handle, (cache = new Map()));
  let stmt = cache.get(sql);
  if (!stmt) cache.set(sql, (stmt = handle.prepare(sql).raw(shape !== undefined)));
  const ready = stmt;
  return db.connection().execute(async () => {
    const rows = ready.all(...params);
    return shape ? (rows as unknown[][]).map(shape) : (rows as T[]);
  });
}

export function membershipRow(db: Kysely<Database>, bandId: string, userId: string): Promise<Membership[]> {
  return all<Membership>(db, `select * from memberships where band_id = ? and user_id = ?`, [bandId, userId]);
}

export function bandNameRow(db: Kysely<Database>, bandId: string): Promise<{ id: string; name: string }[]> {
  return all(db, `select id, name from bands where id = ?`, [bandId]);
}

/**
 * The band and its cursor: the seq of its newest change (0 with none), one seek on the feed index
 * changes_band_feed (band_id, seq, …). A poll whose `since` is already there has nothing to read.
 */
export function bandCursorRow(db: Kysely<Database>, bandId: string): Promise<{ id: string; name: string; head: number }[]> {
  return all(
    db,
    `select b.id, b.name, coalesce((select max(c.seq) from changes c where c.band_id = b.id), 0) as head from bands b where b.id = ?`,
    [bandId],
    (r) => ({ id: r[0] as string, name: r[1] as string, head: Number(r[2]) }),
  );
}

export interface FeedChange {
  seq: number;
  entity: string;
  entity_id: string;
  op: string;
  user_id: string | null;
}

// "Latest change of each entity": a change is skipped when a later one of the same entity, visible
// to this user, exists. Both sides are answered from covering indexes (migration 004).
const LATEST = `not exists (select 1 from changes d where d.entity = c.entity and d.entity_id = c.entity_id
  and d.band_id = c.band_id and d.seq > c.seq and (d.user_id is null or d.user_id = ?))`;

/** Up to `limit` changes after `since` visible to `userId`, each entity at its latest change only. */
export function feedPageRows(db: Kysely<Database>, bandId: string, userId: string, since: number, limit: number): Promise<FeedChange[]> {
  return all(
    db,
    `select c.seq, c.entity, c.entity_id, c.op, c.user_id from changes c
     where c.band_id = ? and c.seq > ? and (c.user_id is null or c.user_id = ?) and ${LATEST}
     order by c.seq limit ?`,
    [bandId, since, userId, userId, limit],
    (r) => ({ seq: r[0] as number, entity: r[1] as string, entity_id: r[2] as string, op: r[3] as string, user_id: r[4] as string | null }),
  );
}

/** How many changes of `entities` after `since` a full pull would still send. */
export async function feedRemainingCount(db: Kysely<Database>, bandId: string, userId: string, since: number, entities: readonly string[]): Promise<number> {
  const marks = entities.map(() => "?").join(", ");
  const rows = await all<{ n: number }>(
    db,
    `select count(c.seq) as n from changes c
     where c.band_id = ? and c.seq > ? and c.entity in (${marks}) and (c.user_id is null or c.user_id = ?) and ${LATEST}`,
    [bandId, since, ...entities, userId, userId],
  );
  return Number(rows[0]?.n ?? 0);
}

export interface FeedChartRow {
  id: string;
  band_id: string;
  title: string;
  composer: string;
  concert_key: string;
  meter: string;
  tempo: number | null;
  feel: string;
  body_json: string;
  source_text: string;
  revision: number;
  updated_at: string;
  updated_by: string;
  deleted_at: string | null;
  updated_by_name: string | null;
}

/** Live charts changed in the feed range (since, until]; the band is checked by the caller. */
export function feedChartRows(db: Kysely<Database>, bandId: string, since: number, until: number): Promise<FeedChartRow[]> {
  return all(
    db,
    `select c.id, c.band_id, c.title, c.composer, c.concert_key, c.meter, c.tempo, c.feel, c.body_json, c.source_text,
       c.revision, c.updated_at, c.updated_by, c.deleted_at, u.name as updated_by_name
     from changes ch inner join charts c on c.id = ch.entity_id left join users u on u.id = c.updated_by
     where ch.band_id = ? and ch.entity = 'chart' and ch.seq > ? and ch.seq <= ? and c.deleted_at is null`,
    [bandId, since, until],
    (r) => ({
      id: r[0] as string, band_id: r[1] as string, title: r[2] as string, composer: r[3] as string, concert_key: r[4] as string,
      meter: r[5] as string, tempo: r[6] as number | null, feel: r[7] as string, body_json: r[8] as string, source_text: r[9] as string,
      revision: r[10] as number, updated_at: r[11] as string, updated_by: r[12] as string, deleted_at: r[13] as string | null,
      updated_by_name: r[14] as string | null,
    }),
  );
}

export interface FeedRevisionRow {
  chart_id: string;
  revision: number;
  title: string;
  message: string;
  created_at: string;
  /** Null for the current revision: its text travels as the chart's own sourceText. */
  source_text: string | null;
  meta_json: string | null;
  current: number;
  author_name: string | null;
}

/** The latest `keep` revisions of the charts changed in (since, until], newest first per chart. */
export function feedRevisionRows(db: Kysely<Database>, bandId: string, since: number, until: number, keep: number): Promise<FeedRevisionRow[]> {
  return all(
    db,
    `select r.chart_id, r.revision, r.title, r.message, r.created_at,
       case when r.revision = c.revision then null else r.source_text end as source_text,
       r.meta_json, c.revision as current, u.name as author_name
     from changes ch inner join charts c on c.id = ch.entity_id inner join chart_revisions r on r.chart_id = c.id
       left join users u on u.id = r.author_id
     where ch.band_id = ? and ch.entity = 'chart' and ch.seq > ? and ch.seq <= ? and r.revision > c.revision - ?
     order by r.chart_id, r.revision desc`,
    [bandId, since, until, keep],
    (r) => ({
      chart_id: r[0] as string, revision: r[1] as number, title: r[2] as string, message: r[3] as string, created_at: r[4] as string,
      source_text: r[5] as string | null, meta_json: r[6] as string | null, current: r[7] as number, author_name: r[8] as string | null,
    }),
  );
}

export interface RosterRow {
  user_id: string;
  name: string;
  email: string;
  role: Membership["role"];
  instrument: string;
  expires_at: string | null;
}

export function rosterRows(db: Kysely<Database>, bandId: string): Promise<RosterRow[]> {
  return all(
    db,
    `select m.user_id, u.name, u.email, m.role, m.instrument, m.expires_at
     from memberships m inner join users u on u.id = m.user_id where m.band_id = ? order by u.name`,
    [bandId],
  );
}
