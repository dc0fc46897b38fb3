import "server-only";
// Calling the tune on a gig: the leader (or the member the leader hands it to) calls a tune from the
// set list; every device following the gig jumps to it. Calls are rows, read by every app process's
// event stream, so nothing about who follows lives in one process's memory.
import type { Kysely } from "kysely";
import { z } from "zod";
import type { Database, Membership } from "@/db/schema";
import { requireMember, type Actor } from "./access";
import { AppError } from "./errors";
import { assertCanSee } from "./setlists";
import { can } from "@/lib/band/roles";

export const CallSchema = z.object({ entryId: z.string().min(1).max(64) }).strict();
export const CallerSchema = z.object({ userId: z.string().min(1).max(64).nullable() }).strict();

export interface TuneCall {
  seq: number;
  setlistId: string;
  entryId: string;
  chartId: string;
  calledBy: string;
  calledByName: string;
  at: string;
}

export interface GigCallState {
  latest: TuneCall | null;
  /** Who calls besides the leader; null: the leader alone. */
  callerId: string | null;
  canCall: boolean;
}

/** Reading a gig's calls: anyone who may see the set list. */
export async function gigReader(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string): Promise<Membership> {
  const m = await requireMember(db, actor, bandId, "readSetlists");
  await assertCanSee(db, m, setlistId);
  const list = await db.selectFrom("setlists").select("id").where("id", "=", setlistId).where("band_id", "=", bandId).where("deleted_at", "is", null).executeTakeFirst();
  if (!list) throw new AppError("not_found", "That set list was not found.");
  return m;
}

async function callerOf(db: Kysely<Database>, setlistId: string): Promise<string | null> {
  return (await db.selectFrom("gig_callers").select("user_id").where("setlist_id", "=", setlistId).executeTakeFirst())?.user_id ?? null;
}

const mayCall = (m: Membership, callerId: string | null) => can(m.role, "callTunes") || m.user_id === callerId;

type CallRow = { seq: number; setlist_id: string; entry_id: string; chart_id: string; called_by: string; created_at: string; name: string | null };
const toCall = (r: CallRow): TuneCall => ({ seq: r.seq, setlistId: r.setlist_id, entryId: r.entry_id, chartId: r.chart_id, calledBy: r.called_by, calledByName: r.name ?? "", at: r.created_at });

function callsQuery(db: Kysely<Database>, setlistId: string) {
  return db
    .selectFrom("gig_calls as g")
    .leftJoin("users as u", "u.id", "g.called_by")
    .select(["g.seq", "g.setlist_id", "g.entry_id", "g.chart_id", "g.called_by", "g.created_at", "u.name"])
    .where("g.setlist_id", "=", setlistId);
}

/** Calls after `seq`, oldest first (what a reconnecting stream has missed). */
export async function callsAfter(db: Kysely<Database>, setlistId: string, seq: number, limit = 50): Promise<TuneCall[]> {
  return (await callsQuery(db, setlistId).where("g.seq", ">", seq).orderBy("g.seq").limit(limit).execute()).map(toCall);
}

export async function latestCall(db: Kysely<Database>, setlistId: string): Promise<TuneCall | null> {
  const r = await callsQuery(db, setlistId).orderBy("g.seq", "desc").limit(1).executeTakeFirst();
  return r ? toCall(r) : null;
}

export async function gigCallState(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string): Promise<GigCallState> {
  const m = await gigReader(db, actor, bandId, setlistId);
  const callerId = await callerOf(db, setlistId);
  return { latest: await latestCall(db, setlistId), callerId, canCall: mayCall(m, callerId) };
}

export async function callTune(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, entryId: string, now = new Date()): Promise<TuneCall> {
  const m = await gigReader(db, actor, bandId, setlistId);
  if (!mayCall(m, await callerOf(db, setlistId))) throw new AppError("forbidden", "Only the leader, or the member the leader handed calling to, calls the tunes.");
  const entry = await db.selectFrom("setlist_entries").select(["id", "chart_id"]).where("id", "=", entryId).where("setlist_id", "=", setlistId).executeTakeFirst();
  if (!entry) throw new AppError("unprocessable", "entryId: that tune is not on this set list", { fields: [{ field: "entryId", message: "that tune is not on this set list" }] });
  const row = await db
    .insertInto("gig_calls")
    .values({ band_id: bandId, setlist_id: setlistId, entry_id: entry.id, chart_id: entry.chart_id, called_by: m.user_id, created_at: now.toISOString() })
    .returning("seq")
    .executeTakeFirstOrThrow();
  return { seq: row.seq, setlistId, entryId: entry.id, chartId: entry.chart_id, calledBy: m.user_id, calledByName: actor?.name ?? "", at: now.toISOString() };
}

/** The leader hands calling to one member of the band (or takes it back with null). */
export async function setCaller(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, userId: string | null, now = new Date()): Promise<{ callerId: string | null }> {
  const m = await requireMember(db, actor, bandId, "manageBand");
  await gigReader(db, actor, bandId, setlistId);
  await db.deleteFrom("gig_callers").where("setlist_id", "=", setlistId).execute();
  if (userId === null) return { callerId: null };
  const member = await db.selectFrom("memberships").select("user_id").where("band_id", "=", bandId).where("user_id", "=", userId).executeTakeFirst();
  if (!member) throw new AppError("unprocessable", "userId: not a member of this band", { fields: [{ field: "userId", message: "not a member of this band" }] });
  await db.insertInto("gig_callers").values({ setlist_id: setlistId, band_id: bandId, user_id: userId, set_by: m.user_id, set_at: now.toISOString() }).execute();
  return { callerId: userId };
}
