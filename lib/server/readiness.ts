import "server-only";
// Ready for tonight: devices say what they hold with each pull (recordDeviceReport); the leader sees,
// for one set list, every member who will read it and each of their devices; and can nudge those behind.
import type { Kysely } from "kysely";
import { z } from "zod";
import type { Database } from "@/db/schema";
import { sendMail } from "@/lib/mail";
import { requireMember, type Actor } from "./access";
import { AppError } from "./errors";
import { fanOut } from "./push";
import { hasSubscription } from "./push-subscriptions";
import { computeReadiness, type DeviceReport, type Holdings, type Needed, type Readiness, type Reader } from "./readiness-model";
import { activeShareUsers } from "./shares";
import { can } from "@/lib/band/roles";

const Id = z.string().min(1).max(64);

export const DeviceReportSchema = z
  .object({
    deviceId: z.string().min(8).max(64),
    label: z.string().max(80).default("A device"),
    cursor: z.number().int().min(0),
    charts: z.record(Id, z.number().int().min(0)).refine((r) => Object.keys(r).length <= 500, "at most 500 charts"),
    setlists: z.record(Id, z.number().int().min(0)).refine((r) => Object.keys(r).length <= 100, "at most 100 set lists"),
    parts: z.record(Id, z.string().max(128)).refine((r) => Object.keys(r).length <= 500, "at most 500 parts"),
  })
  .strict();
export type DeviceReportInput = z.infer<typeof DeviceReportSchema>;

export const NudgeSchema = z.object({ userIds: z.array(Id).max(100).optional() }).strict();

export async function recordDeviceReport(db: Kysely<Database>, actor: Actor | null, bandId: string, r: DeviceReportInput, now = new Date()): Promise<void> {
  const m = await requireMember(db, actor, bandId, "belong");
  const holdings: Holdings = { charts: r.charts, setlists: r.setlists, parts: r.parts };
  const row = { user_id: m.user_id, label: r.label, cursor: r.cursor, holdings_json: JSON.stringify(holdings), reported_at: now.toISOString() };
  await db
    .insertInto("device_reports")
    .values({ device_id: r.deviceId, band_id: bandId, ...row })
    .onConflict((oc) => oc.columns(["device_id", "band_id"]).doUpdateSet(row))
    .execute();
}

async function needed(db: Kysely<Database>, bandId: string, setlistId: string): Promise<Needed> {
  const list = await db.selectFrom("setlists").select(["id", "name", "revision"]).where("id", "=", setlistId).where("band_id", "=", bandId).where("deleted_at", "is", null).executeTakeFirst();
  if (!list) throw new AppError("not_found", "That set list was not found.");
  const entries = await db.selectFrom("setlist_entries").select("chart_id").where("setlist_id", "=", setlistId).execute();
  const ids = [...new Set(entries.map((e) => e.chart_id))];
  const charts = ids.length ? await db.selectFrom("charts").select(["id", "title", "revision"]).where("id", "in", ids).where("band_id", "=", bandId).where("deleted_at", "is", null).execute() : [];
  const titles = new Map(charts.map((c) => [c.id, c.title]));
  const parts = ids.length
    ? await db.selectFrom("attachments").select(["id", "chart_id", "filename", "sha256"]).where("chart_id", "in", ids).where("band_id", "=", bandId).where("deleted_at", "is", null).execute()
    : [];
  return {
    setlist: { id: list.id, name: list.name, revision: list.revision },
    charts: charts.sort((a, b) => a.title.localeCompare(b.title)),
    parts: parts.map((p) => ({ id: p.id, chartTitle: titles.get(p.chart_id) ?? "", filename: p.filename, sha256: p.sha256 })),
  };
}

/** Members who will read the set list: every member but subs, and subs with a live share of it. */
async function readers(db: Kysely<Database>, bandId: string, setlistId: string, now: Date): Promise<(Reader & { email: string })[]> {
  const shared = new Set(await activeShareUsers(db, setlistId, now));
  const rows = await db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["m.user_id", "m.role", "m.expires_at", "u.name", "u.email"])
    .where("m.band_id", "=", bandId)
    .execute();
  const people = rows.filter((r) => !(r.expires_at && r.expires_at <= now.toISOString()) && (can(r.role, "readBook") || shared.has(r.user_id)));
  const reports = people.length
    ? await db.selectFrom("device_reports").selectAll().where("band_id", "=", bandId).where("user_id", "in", people.map((p) => p.user_id)).execute()
    : [];
  return people.map((p) => ({
    userId: p.user_id,
    name: p.name,
    email: p.email,
    role: p.role,
    devices: reports
      .filter((d) => d.user_id === p.user_id)
      .map((d): DeviceReport => ({ deviceId: d.device_id, label: d.label, reportedAt: d.reported_at, cursor: d.cursor, holdings: JSON.parse(d.holdings_json) as Holdings })),
  }));
}

export async function setlistReadiness(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, now = new Date()): Promise<Readiness> {
  await requireMember(db, actor, bandId, "editSetlists");
  const need = await needed(db, bandId, setlistId);
  return computeReadiness(need, await readers(db, bandId, setlistId, now));
}

export interface NudgeResult {
  pushed: string[];
  mailed: string[];
}

/** Tells the members behind on this set list to open Pedalpoint with signal: a push, or e-mail without one. */
export async function nudgeMembers(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, userIds: string[] | undefined, now = new Date()): Promise<NudgeResult> {
  const leader = await requireMember(db, actor, bandId, "nudgeBand");
  const need = await needed(db, bandId, setlistId);
  const people = await readers(db, bandId, setlistId, now);
  const state = computeReadiness(need, people);
  const behind = state.members.filter((m) => !m.ready && m.userId !== leader.user_id && (!userIds || userIds.includes(m.userId)));
  const out: NudgeResult = { pushed: [], mailed: [] };
  const base = process.env.NEXTAUTH_URL ?? "http://localhost:3000";
  const link = `${base}/bands/${encodeURIComponent(bandId)}/setlists/${encodeURIComponent(setlistId)}`;
  for (const m of behind) {
    if (await hasSubscription(db, bandId, m.userId)) {
      const r = await fanOut(db, { bandId, authorId: null, kind: "nudge", setlistId, onlyUsers: [m.userId] }, now);
      if (r.sent > 0) {
        out.pushed.push(m.name);
        continue;
      }
    }
    const email = people.find((p) => p.userId === m.userId)?.email;
    if (!email) continue;
    const text = `Your band's book for “${need.setlist.name}” has changed since your device last synced. Open Pedalpoint with signal before the gig so the charts are on your device:\n\n${link}\n`;
    await sendMail({ to: email, subject: `Sync before “${need.setlist.name}”`, text, html: `<p>${text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/\n\n.*\n$/, "")}</p><p><a href="${link}">Open the set list</a></p>` });
    out.mailed.push(m.name);
  }
  return out;
}
