import "server-only";
// Set lists: the gig, its sets and each tune's arrangement. Leaders and arrangers edit; players read
// every set list; a sub reads only the ones shared with them, while the share lasts.
import type { Kysely, Transaction } from "kysely";
import type { Database, Membership, SetlistEntryRow, SetlistRow } from "@/db/schema";
import { ChartSchema, type Chart } from "@/lib/chart/model";
import {
  checkArrangement,
  SetlistCreateSchema,
  SetlistDuplicateSchema,
  SetlistUpdateSchema,
  type SetlistEntry,
} from "@/lib/setlist";
import type { WireSetlist } from "@/lib/wire";
import { assertMay, requireMember, type Actor } from "./access";
import { recordChange } from "./changes";
import { AppError, notFound, type FieldIssue } from "./errors";
import { parseInput } from "./input";
import { loadSetlists, parseJson } from "./setlist-rows";
import { activeShareUsers, sharedSetlistIds } from "./shares";
import { newId, nowIso } from "./tokens";
import { can } from "@/lib/band/roles";

type Db = Kysely<Database> | Transaction<Database>;

export { loadSetlists, toSetlist } from "./setlist-rows";

export interface SetlistSummary {
  id: string;
  name: string;
  startsAt: string | null;
  venue: string;
  tunes: number;
  sets: number;
  revision: number;
  updatedAt: string;
}

async function loadOne(db: Db, bandId: string, id: string): Promise<{ row: SetlistRow; setlist: WireSetlist } | null> {
  return (await loadSetlists(db, bandId, [id])).get(id) ?? null;
}

/** Throws 404 unless this member may see this set list (a sub: only while it is shared with them). */
export async function assertCanSee(db: Db, m: Membership, setlistId: string, now = new Date()): Promise<void> {
  if (can(m.role, "readAllSetlists")) return;
  const ids = await sharedSetlistIds(db, m.band_id, m.user_id, now);
  if (!ids.includes(setlistId)) throw notFound("That set list");
}

export async function listSetlists(db: Kysely<Database>, actor: Actor | null, bandId: string, now = new Date()): Promise<SetlistSummary[]> {
  const m = await requireMember(db, actor, bandId, "readSetlists");
  let q = db.selectFrom("setlists").selectAll().where("band_id", "=", bandId).where("deleted_at", "is", null);
  if (!can(m.role, "readAllSetlists")) {
    const ids = await sharedSetlistIds(db, bandId, m.user_id, now);
    if (ids.length === 0) return [];
    q = q.where("id", "in", ids);
  }
  const rows = await q.orderBy("starts_at", "desc").orderBy("name").execute();
  if (rows.length === 0) return [];
  const counts = await db
    .selectFrom("setlist_entries")
    .select(["setlist_id", "set_number"])
    .where("setlist_id", "in", rows.map((r) => r.id))
    .execute();
  return rows.map((r) => {
    const mine = counts.filter((c) => c.setlist_id === r.id);
    return {
      id: r.id,
      name: r.name,
      startsAt: r.starts_at,
      venue: r.venue,
      tunes: mine.length,
      sets: new Set(mine.map((c) => c.set_number)).size,
      revision: r.revision,
      updatedAt: r.updated_at,
    };
  });
}

export async function getSetlist(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, now = new Date()): Promise<WireSetlist> {
  const m = await requireMember(db, actor, bandId, "readSetlists");
  await assertCanSee(db, m, setlistId, now);
  const found = await loadOne(db, bandId, setlistId);
  if (!found || found.row.deleted_at) throw notFound("That set list");
  return found.setlist;
}

/** Every entry checked against its chart; refusals name the entry's field ("entries.2.intro.kind"). */
export async function checkEntries(db: Db, bandId: string, entries: readonly SetlistEntry[]): Promise<void> {
  if (entries.length === 0) return;
  const chartIds = [...new Set(entries.map((e) => e.chartId))];
  const rows = await db
    .selectFrom("charts")
    .select(["id", "body_json"])
    .where("band_id", "=", bandId)
    .where("deleted_at", "is", null)
    .where("id", "in", chartIds)
    .execute();
  const charts = new Map<string, Chart | null>(rows.map((r) => [r.id, parseJson(r.body_json, ChartSchema)]));
  const fields: FieldIssue[] = [];
  entries.forEach((e, i) => {
    const chart = charts.get(e.chartId) ?? null;
    for (const issue of checkArrangement(chart, e).issues) fields.push({ field: `entries.${i}.${issue.field}`, message: issue.message });
  });
  const first = fields[0];
  if (first) throw new AppError("unprocessable", first.message, { fields });
}

function entryRow(setlistId: string, bandId: string, e: SetlistEntry): SetlistEntryRow {
  return {
    id: e.id,
    setlist_id: setlistId,
    band_id: bandId,
    set_number: e.setNumber,
    position: e.position,
    chart_id: e.chartId,
    key: e.key,
    intro_json: e.intro ? JSON.stringify(e.intro) : null,
    ending: e.ending ? JSON.stringify(e.ending) : null,
    tempo: e.tempo,
    solo_order: e.soloOrder,
    choruses: e.choruses,
    straight_in: e.straightIn ? 1 : 0,
    notes: e.notes,
  };
}

async function writeEntries(trx: Transaction<Database>, setlistId: string, bandId: string, entries: readonly SetlistEntry[]): Promise<void> {
  await trx.deleteFrom("setlist_entries").where("setlist_id", "=", setlistId).execute();
  if (entries.length > 0) {
    await trx.insertInto("setlist_entries").values(entries.map((e) => entryRow(setlistId, bandId, e))).execute();
  }
}

/** An entry id belongs to one set list; ids reused from another one (a copy-paste) are renewed. */
async function freshEntryIds(trx: Transaction<Database>, setlistId: string, entries: readonly SetlistEntry[]): Promise<SetlistEntry[]> {
  if (entries.length === 0) return [];
  const taken = await trx
    .selectFrom("setlist_entries")
    .select("id")
    .where("id", "in", entries.map((e) => e.id))
    .where("setlist_id", "!=", setlistId)
    .execute();
  const clash = new Set(taken.map((t) => t.id));
  return entries.map((e) => (clash.has(e.id) ? { ...e, id: newId() } : e));
}

/** Subs holding a share of this set list get the charts in it delivered through their private feed. */
async function deliverChartsToSubs(trx: Transaction<Database>, bandId: string, setlistId: string, chartIds: readonly string[], now: Date): Promise<void> {
  if (chartIds.length === 0) return;
  for (const userId of await activeShareUsers(trx, setlistId, now)) {
    for (const chartId of new Set(chartIds)) {
      await recordChange(trx, { bandId, entity: "chart", entityId: chartId, op: "upsert", userId });
    }
  }
}

export interface SetlistWrite {
  name: string;
  startsAt: string | null;
  venue: string;
  notes: string;
  setMinutes?: (number | null)[];
  entries: SetlistEntry[];
}

export interface SaveSetlistOptions {
  id: string;
  data: SetlistWrite;
  /** null: create (refused when the id is taken); a number: replace that revision (else a conflict). */
  baseRevision: number | null;
  now?: Date;
}

/**
 * Creates or replaces a set list as a member already resolved by the one access check (requireMember).
 * Shared by the routes and the sync push; checks the member may edit set lists.
 */
export async function saveSetlistAs(db: Kysely<Database>, member: Membership, { id, data, baseRevision, now = new Date() }: SaveSetlistOptions): Promise<WireSetlist> {
  assertMay(member, "editSetlists");
  const bandId = member.band_id;
  const actorId = member.user_id;
  await checkEntries(db, bandId, data.entries);
  return db.transaction().execute(async (trx) => {
    const current = await trx.selectFrom("setlists").selectAll().where("id", "=", id).executeTakeFirst();
    if (current && current.band_id !== bandId) throw notFound("That set list");
    if (baseRevision === null && current && !current.deleted_at) {
      throw new AppError("conflict", "A set list with that id already exists.", { current: (await loadOne(trx, bandId, id))?.setlist });
    }
    if (baseRevision !== null && (!current || current.deleted_at)) throw notFound("That set list");
    if (baseRevision !== null && current && current.revision !== baseRevision) {
      throw new AppError("conflict", "Someone else changed this set list while you were editing. Their version is shown; apply your changes again.", {
        current: (await loadOne(trx, bandId, id))?.setlist,
      });
    }
    const before = current ? await trx.selectFrom("setlist_entries").select("chart_id").where("setlist_id", "=", id).execute() : [];
    const revision = current ? current.revision + 1 : 1;
    const fields = {
      name: data.name,
      starts_at: data.startsAt ? new Date(data.startsAt).toISOString() : null,
      venue: data.venue,
      notes: data.notes,
      set_minutes_json: JSON.stringify(data.setMinutes ?? []),
      revision,
      updated_by: actorId,
      updated_at: nowIso(now),
      deleted_at: null,
    };
    if (current) await trx.updateTable("setlists").set(fields).where("id", "=", id).execute();
    else await trx.insertInto("setlists").values({ id, band_id: bandId, ...fields }).execute();
    const entries = await freshEntryIds(trx, id, data.entries);
    await writeEntries(trx, id, bandId, entries);
    await recordChange(trx, { bandId, entity: "setlist", entityId: id, op: "upsert" });
    const had = new Set(before.map((b) => b.chart_id));
    await deliverChartsToSubs(trx, bandId, id, entries.map((e) => e.chartId).filter((c) => !had.has(c)), now);
    const saved = await loadOne(trx, bandId, id);
    if (!saved) throw new Error("set list vanished inside its own transaction");
    return saved.setlist;
  });
}

export async function createSetlist(db: Kysely<Database>, actor: Actor | null, bandId: string, input: unknown, now = new Date()): Promise<WireSetlist> {
  const member = await requireMember(db, actor, bandId, "editSetlists");
  const data = parseInput(SetlistCreateSchema, input);
  return saveSetlistAs(db, member, { id: data.id ?? newId(), data, baseRevision: null, now });
}

export async function updateSetlist(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  setlistId: string,
  input: unknown,
  now = new Date(),
): Promise<WireSetlist> {
  const member = await requireMember(db, actor, bandId, "editSetlists");
  const data = parseInput(SetlistUpdateSchema, input);
  return saveSetlistAs(db, member, { id: setlistId, data, baseRevision: data.baseRevision, now });
}

/** Deletes a set list (and ends its shares) as an already-resolved member who may edit set lists. */
export async function deleteSetlistAs(db: Kysely<Database>, member: Membership, { id: setlistId, now = new Date() }: { id: string; now?: Date }): Promise<void> {
  assertMay(member, "editSetlists");
  const bandId = member.band_id;
  const actorId = member.user_id;
  await db.transaction().execute(async (trx) => {
    const r = await trx
      .updateTable("setlists")
      .set({ deleted_at: nowIso(now), updated_at: nowIso(now), updated_by: actorId })
      .where("id", "=", setlistId)
      .where("band_id", "=", bandId)
      .where("deleted_at", "is", null)
      .executeTakeFirst();
    if (Number(r.numUpdatedRows) !== 1) throw notFound("That set list");
    // A deleted gig ends its shares; the subs' devices drop it at their next sync.
    await trx.updateTable("shares").set({ revoked_at: nowIso(now) }).where("setlist_id", "=", setlistId).where("revoked_at", "is", null).execute();
    await recordChange(trx, { bandId, entity: "setlist", entityId: setlistId, op: "delete" });
  });
}

export async function deleteSetlist(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, now = new Date()): Promise<void> {
  const member = await requireMember(db, actor, bandId, "editSetlists");
  await deleteSetlistAs(db, member, { id: setlistId, now });
}

/** A copy for the next gig: same sets, tunes and arrangements, new name/date/venue if given. Shares are not copied. */
export async function duplicateSetlist(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  setlistId: string,
  input: unknown,
  now = new Date(),
): Promise<WireSetlist> {
  const member = await requireMember(db, actor, bandId, "editSetlists");
  const opts = parseInput(SetlistDuplicateSchema, input ?? {});
  const found = await loadOne(db, bandId, setlistId);
  if (!found || found.row.deleted_at) throw notFound("That set list");
  const src = found.setlist;
  return saveSetlistAs(db, member, {
    id: opts.id ?? newId(),
    baseRevision: null,
    now,
    data: {
      name: opts.name ?? `${src.name} (copy)`,
      startsAt: opts.startsAt !== undefined ? opts.startsAt : src.startsAt,
      venue: opts.venue ?? src.venue,
      notes: src.notes,
      setMinutes: src.setMinutes,
      entries: src.entries.map((e) => ({
        id: newId(),
        chartId: e.chartId,
        setNumber: e.setNumber,
        position: e.position,
        key: e.key,
        tempo: e.tempo,
        intro: e.intro,
        ending: e.ending,
        soloOrder: e.soloOrder,
        choruses: e.choruses,
        straightIn: e.straightIn,
        notes: e.notes,
      })),
    },
  });
}
