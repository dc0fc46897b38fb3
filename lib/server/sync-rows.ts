import "server-only";
// Rows of the sync feed as JSON text in the wire shapes of lib/wire.ts.
// Stored JSON columns are spliced in unparsed; only short scalar fields go through JSON.stringify.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { feedChartRows, feedRevisionRows } from "@/db/sync-queries";

/** How many of a chart's latest revisions travel with it (the history list on the device). */
export const HISTORY_LIMIT = 10;

export interface LoadedRow {
  json: string;
  /** The chart a row hangs off, for filtering what a sub may see. */
  chartId?: string;
}
export type Loaded = Map<string, LoadedRow>;

const s = JSON.stringify;

/** Stored JSON text (written by the use cases with JSON.stringify), or `null` when the column is empty. */
function splice(text: string | null): string {
  if (text === null || text === "") return "null";
  return text;
}

/** A page of the feed, (since, until]: charts are found by joining it, a fixed-shape query. */
export interface FeedRange {
  since: number;
  until: number;
}

const CHART_COLUMNS = [
  "c.id", "c.band_id", "c.title", "c.composer", "c.concert_key", "c.meter", "c.tempo", "c.feel", "c.body_json",
  "c.source_text", "c.revision", "c.updated_at", "c.updated_by", "c.deleted_at", "u.name as updated_by_name",
] as const;
const REVISION_COLUMNS = [
  "r.chart_id", "r.revision", "r.title", "r.message", "r.created_at", "r.source_text", "r.meta_json", "c.revision as current", "u.name as author_name",
] as const;

async function chartRows(db: Kysely<Database>, bandId: string, ids: string[], range?: FeedRange) {
  if (range) return feedChartRows(db, bandId, range.since, range.until);
  return db.selectFrom("charts as c").leftJoin("users as u", "u.id", "c.updated_by").select(CHART_COLUMNS).where("c.id", "in", ids).where("c.deleted_at", "is", null).execute();
}

async function revisionRows(db: Kysely<Database>, ids: string[], range?: FeedRange, bandId?: string) {
  if (range && bandId) return feedRevisionRows(db, bandId, range.since, range.until, HISTORY_LIMIT);
  return db
    .selectFrom("chart_revisions as r")
    .innerJoin("charts as c", "c.id", "r.chart_id")
    .leftJoin("users as u", "u.id", "r.author_id")
    .select(REVISION_COLUMNS)
    .where("r.chart_id", "in", ids)
    .where((eb) => eb("r.revision", ">", eb(eb.ref("c.revision"), "-", HISTORY_LIMIT)))
    .orderBy("r.chart_id")
    .orderBy("r.revision", "desc")
    .execute();
}

/**
 * The charts `ids` (all in `range` when given: the pull passes its page, the push one id).
 * The band is checked here, not in SQL: a band_id condition on charts makes SQLite walk the whole book.
 */
export async function loadCharts(db: Kysely<Database>, bandId: string, ids: string[], range?: FeedRange): Promise<Loaded> {
  const out: Loaded = new Map();
  if (ids.length === 0) return out;
  const wanted = new Set(ids);
  const rows = (await chartRows(db, bandId, ids, range)).filter((c) => c.band_id === bandId && wanted.has(c.id));
  if (rows.length === 0) return out;
  const revs = await revisionRows(db, ids, range, bandId);
  const history = new Map<string, string[]>();
  const seenRev = new Set<string>();
  for (const r of revs) {
    const key = `${r.chart_id}:${r.revision}`;
    if (!wanted.has(r.chart_id) || seenRev.has(key)) continue;
    seenRev.add(key);
    const list = history.get(r.chart_id) ?? [];
    list.push(
      `{"revision":${r.revision},"title":${s(r.title)},"message":${s(r.message)},"authorName":${s(r.author_name ?? "")},` +
        `"createdAt":${s(r.created_at)},"sourceText":${r.revision === r.current ? "null" : s(r.source_text)},"meta":${splice(r.meta_json)}}`,
    );
    history.set(r.chart_id, list);
  }
  for (const c of rows) {
    out.set(c.id, {
      json:
        `{"id":${s(c.id)},"bandId":${s(c.band_id)},"title":${s(c.title)},"composer":${s(c.composer)},` +
        `"key":${s(c.concert_key)},"meter":${s(c.meter)},"tempo":${c.tempo === null ? "null" : Number(c.tempo)},` +
        `"feel":${s(c.feel)},"revision":${Number(c.revision)},"updatedAt":${s(c.updated_at)},` +
        `"updatedBy":{"id":${s(c.updated_by)},"name":${s(c.updated_by_name ?? "")}},"deletedAt":${c.deleted_at === null ? "null" : s(c.deleted_at)},` +
        `"sourceText":${s(c.source_text)},` +
        `"history":[${(history.get(c.id) ?? []).join(",")}],"body":${splice(c.body_json)}}`,
    });
  }
  return out;
}

export async function loadAttachments(db: Kysely<Database>, bandId: string, ids: string[]): Promise<Loaded> {
  const out: Loaded = new Map();
  if (ids.length === 0) return out;
  const rows = await db
    .selectFrom("attachments")
    .selectAll()
    .where("band_id", "=", bandId)
    .where("id", "in", ids)
    .where("deleted_at", "is", null)
    .execute();
  for (const a of rows) {
    out.set(a.id, {
      chartId: a.chart_id,
      json:
        `{"id":${s(a.id)},"chartId":${s(a.chart_id)},"filename":${s(a.filename)},"sha256":${s(a.sha256)},"size":${Number(a.size)},` +
        `"type":${s(a.type)},"pages":${a.pages === null ? "null" : Number(a.pages)},"createdAt":${s(a.created_at)},` +
        `"partName":${a.part_name === null ? "null" : s(a.part_name)},"instrument":${a.instrument === null ? "null" : s(a.instrument)}}`,
    });
  }
  return out;
}
