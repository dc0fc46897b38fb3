import "server-only";
// The pull side of delta sync: one page of the band's change feed, each entity once at its latest
// state, filtered by what the caller may see. Stored JSON text (chart bodies, intros, marks) is spliced
// into the response string as it is, never parsed and re-serialised: that is what keeps a pull cheap.
import { createHash } from "node:crypto";
import type { Kysely } from "kysely";
import type { Database, Membership } from "@/db/schema";
import { bandCursorRow, feedPageRows, feedRemainingCount, rosterRows } from "@/db/sync-queries";
import type { PullQuery } from "@/lib/offline/protocol";
import { requireMember, type Actor } from "./access";
import { AppError } from "./errors";
import { toWireMember } from "./members";
import { sharedSetlistIds } from "./shares";
import { loadMarkFeedRows, loadSetlistFeedRows, type FeedRow } from "./setlist-feed";
import { loadAttachments, loadCharts } from "./sync-rows";
import { PullBody, cachedPull, handleTag, keepPull } from "./pull-cache";
import { can } from "@/lib/band/roles";

const PULL_ENTITIES = new Set(["chart", "setlist", "annotation", "attachment"]);

/** What a sub may see: the set lists shared with them (live shares only) and the charts on them. */
interface Visible {
  setlists: Set<string>;
  charts: Set<string>;
  /** Set lists ever shared with this sub: the only ones a delete may name (others' ids stay unknown). */
  onceSetlists: Set<string>;
}

async function visibleToSub(db: Kysely<Database>, bandId: string, userId: string, now: Date): Promise<Visible> {
  const setlists = new Set(await sharedSetlistIds(db, bandId, userId, now));
  const ever = await db.selectFrom("shares").select("setlist_id").where("band_id", "=", bandId).where("user_id", "=", userId).execute();
  const onceSetlists = new Set([...setlists, ...ever.map((s) => s.setlist_id)]);
  const charts = new Set<string>();
  if (setlists.size > 0) {
    const entries = await db.selectFrom("setlist_entries").select("chart_id").where("setlist_id", "in", [...setlists]).execute();
    for (const e of entries) charts.add(e.chart_id);
  }
  return { setlists, charts, onceSetlists };
}

function scopeOf(m: Membership, visible: Visible | null): string {
  if (!visible) return m.role;
  const h = createHash("sha256");
  for (const id of [...visible.setlists].sort()) h.update(`s${id};`);
  for (const id of [...visible.charts].sort()) h.update(`c${id};`);
  return `sub:${h.digest("base64url").slice(0, 22)}`;
}

async function rosterJson(db: Kysely<Database>, bandId: string): Promise<string> {
  const rows = await rosterRows(db, bandId);
  return JSON.stringify(rows.map(toWireMember));
}

/** Deletes for everything in the band a sub can no longer see (their share ended or changed). */
async function subRetractions(db: Kysely<Database>, bandId: string, visible: Visible): Promise<{ key: string; json: string }[]> {
  const out: { key: string; json: string }[] = [];
  const charts = await db.selectFrom("charts").select("id").where("band_id", "=", bandId).execute();
  for (const c of charts) if (!visible.charts.has(c.id)) out.push({ key: `chart:${c.id}`, json: deleteJson("chart", c.id) });
  for (const id of visible.onceSetlists) if (!visible.setlists.has(id)) out.push({ key: `setlist:${id}`, json: deleteJson("setlist", id) });
  return out;
}

function byId<T>(rows: FeedRow<T>[]): Map<string, FeedRow<T>> {
  return new Map(rows.map((r) => [r.id, r]));
}

function deleteJson(entity: string, id: string): string {
  return `{"entity":${JSON.stringify(entity)},"id":${JSON.stringify(id)},"op":"delete"}`;
}

function upsertJson(entity: string, id: string, data: string): string {
  return `{"entity":${JSON.stringify(entity)},"id":${JSON.stringify(id)},"op":"upsert","data":${data}}`;
}

/**
 * One page of the feed as JSON text (a `PullResponse`). Throws 404 for outsiders and subs whose
 * access ended, which tells the device to delete the band's data.
 */
export async function pullChanges(db: Kysely<Database>, actor: Actor | null, bandId: string, q: PullQuery, now = new Date()): Promise<string> {
  return (await pullBody(db, actor, bandId, q, now)).text;
}

/** The same page as a PullBody (bytes and gzip made once), from the page cache when it is there. */
export async function pullBody(db: Kysely<Database>, actor: Actor | null, bandId: string, q: PullQuery, now = new Date()): Promise<PullBody> {
  const m = await requireMember(db, actor, bandId, "belong");
  const userId = m.user_id;
  const [band] = await bandCursorRow(db, bandId);
  if (!band) throw new AppError("not_found", "That band was not found.");
  const visible = !can(m.role, "readBook") ? await visibleToSub(db, bandId, userId, now) : null;
  const scope = scopeOf(m, visible);
  const rescoped = q.scope !== undefined && q.scope !== scope;
  const since = rescoped ? 0 : q.since;
  const head = (extra: string) =>
    `{"seq":${since},"more":false,"scope":${JSON.stringify(scope)}${extra},"band":${JSON.stringify({ id: band.id, name: band.name })},` +
    `"membership":${JSON.stringify({ bandId, role: m.role, instrument: m.instrument, expiresAt: m.expires_at })}`;
  // Up to date (the usual poll): the band's cursor says there is nothing after `since`, so the feed
  // is not read. A leader's very first pull still goes the long way, for the roster.
  if (since >= band.head && (since > 0 || !can(m.role, "manageMembers"))) {
    const total = q.count === "1" ? `,"total":${visible ? visible.charts.size + visible.setlists.size : 0}` : "";
    return new PullBody(`${head(total)},"changes":[]}`);
  }
  // Subs are left out of the cache: what they may see changes with the clock (shares end).
  const key = visible ? null : JSON.stringify([handleTag(db), bandId, band.name, band.head, userId, m.role, m.instrument, m.expires_at, scope, since, q.limit, q.count ?? "0"]);
  const hit = key ? cachedPull(key) : null;
  if (hit) return hit;
  const body = new PullBody(await buildPage(db, m, bandId, band, { since, rescoped, scope, visible, limit: q.limit, count: q.count === "1" }, now));
  if (key) keepPull(key, body);
  return body;
}

interface PageAsk {
  since: number;
  rescoped: boolean;
  scope: string;
  visible: Visible | null;
  limit: number;
  count: boolean;
}

async function buildPage(db: Kysely<Database>, m: Membership, bandId: string, band: { id: string; name: string }, ask: PageAsk, now: Date): Promise<string> {
  const { since, rescoped, scope, visible } = ask;
  const userId = m.user_id;
  const q = { limit: ask.limit };

  const rows = await feedPageRows(db, bandId, userId, since, q.limit + 1);
  const more = rows.length > q.limit;
  const page = more ? rows.slice(0, q.limit) : rows;
  const seq = page.length > 0 ? page[page.length - 1]!.seq : since;

  const ids: Record<string, string[]> = { chart: [], setlist: [], annotation: [], attachment: [] };
  const retract = new Set<number>();
  const picked = new Set<number>();
  let membershipChanged = false;
  for (const r of page) {
    if (r.entity === "membership") membershipChanged = true;
    if (!PULL_ENTITIES.has(r.entity)) continue;
    if (visible && r.entity === "chart" && !visible.charts.has(r.entity_id)) {
      // A change addressed to this sub about a chart they can no longer see: take it off the device.
      if (r.user_id === userId) retract.add(r.seq);
      continue;
    }
    if (visible && r.entity === "setlist" && !visible.setlists.has(r.entity_id)) {
      // Another set list of the band: a sub learns nothing of it, not even its id, unless it was once theirs.
      if (visible.onceSetlists.has(r.entity_id)) retract.add(r.seq);
      continue;
    }
    ids[r.entity]!.push(r.entity_id);
    picked.add(r.seq);
  }
  const charts = await loadCharts(db, bandId, ids.chart!, { since, until: seq });
  const attachments = await loadAttachments(db, bandId, ids.attachment!);
  // Set lists and marks come from their own module, which knows what a sub may see of them.
  const setlists = byId(await loadSetlistFeedRows(db, m, ids.setlist!, now));
  const marks = byId(await loadMarkFeedRows(db, m, ids.annotation!));

  const retracted = rescoped && visible ? await subRetractions(db, bandId, visible) : [];
  const changes = retracted.map((r) => r.json);
  const deleted = new Set(retracted.map((r) => r.key));
  const drop = (entity: string, id: string) => {
    if (!deleted.has(`${entity}:${id}`)) changes.push(deleteJson(entity, id));
  };
  for (const r of page) {
    if (retract.has(r.seq)) drop(r.entity, r.entity_id);
    if (!picked.has(r.seq)) continue;
    if (r.entity === "chart" || r.entity === "attachment") {
      const row = (r.entity === "chart" ? charts : attachments).get(r.entity_id);
      if (visible && row?.chartId && !visible.charts.has(row.chartId)) continue;
      if (row) changes.push(upsertJson(r.entity, r.entity_id, row.json));
      else drop(r.entity, r.entity_id);
      continue;
    }
    const feed = (r.entity === "setlist" ? setlists : marks).get(r.entity_id);
    if (!feed) continue;
    if (feed.op === "delete") drop(r.entity, r.entity_id);
    else if (!(visible && r.entity === "annotation" && !visible.charts.has((feed.data as { chartId: string }).chartId))) {
      changes.push(upsertJson(r.entity, r.entity_id, JSON.stringify(feed.data)));
    }
  }

  const total = ask.count ? (visible ? visible.charts.size + visible.setlists.size : await feedRemainingCount(db, bandId, userId, since, [...PULL_ENTITIES])) : undefined;
  const withRoster = can(m.role, "manageMembers") && (since === 0 || membershipChanged);
  const membership = { bandId, role: m.role, instrument: m.instrument, expiresAt: m.expires_at };
  let out = `{"seq":${seq},"more":${more},"scope":${JSON.stringify(scope)}`;
  if (total !== undefined) out += `,"total":${total}`;
  out += `,"band":${JSON.stringify({ id: band.id, name: band.name })},"membership":${JSON.stringify(membership)}`;
  if (withRoster) out += `,"members":${await rosterJson(db, bandId)}`;
  out += `,"changes":[${changes.join(",")}]}`;
  return out;
}
