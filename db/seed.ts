// The demo: an invented band in an invented town, its members in all four roles, and its book.
// Idempotent: fixed ids, inserts that skip rows already there, so a second run changes nothing
// (and leaves the demo band's own edits alone).
import bcrypt from "bcryptjs";
import type { Kysely, Transaction } from "kysely";
import { createHash } from "node:crypto";
import { parseChartText } from "@/lib/chart";
import { DEMO_CHARTS } from "./demo-charts";
import { DEMO_GIG, demoGigStart, demoShareEnd } from "./demo-gig";
import type { Role } from "@/lib/band/roles";
import type { Database } from "./schema";

export const DEMO_PASSWORD = "pedalpoint-demo";

export const DEMO_BAND = {
  name: "The Saltmarsh Regulars",
  city: "Port Wren",
  /** Where they play on Thursdays (for set lists and the README). */
  venue: "The Lanternfish Room",
};

export interface DemoAccount {
  email: string;
  password: string;
  name: string;
  role: Role;
  /** What they play, in words. */
  instrumentName: string;
  /** The part they read: an instrument id from lib/music. */
  instrument: "concert" | "concert-bass" | "bb" | "eb" | "f";
}

export const DEMO_ACCOUNTS: DemoAccount[] = [
  { email: "odile@saltmarsh.test", name: "Odile Marchbank", role: "leader", instrumentName: "trumpet", instrument: "bb" },
  { email: "teodor@saltmarsh.test", name: "Teodor Vance", role: "arranger", instrumentName: "piano", instrument: "concert" },
  { email: "priya@saltmarsh.test", name: "Priya Halloran", role: "player", instrumentName: "alto sax", instrument: "eb" },
  { email: "gus@saltmarsh.test", name: "Gus Ferreira-Lind", role: "player", instrumentName: "trombone", instrument: "concert-bass" },
  { email: "mabel@saltmarsh.test", name: "Mabel Okonjo", role: "player", instrumentName: "bass", instrument: "concert-bass" },
  { email: "rafe@saltmarsh.test", name: "Rafe Castellan", role: "player", instrumentName: "drums", instrument: "concert" },
  { email: "ines@saltmarsh.test", name: "Ines Delacroix-Moore", role: "player", instrumentName: "voice", instrument: "concert" },
  { email: "jonah@saltmarsh.test", name: "Jonah Pike", role: "sub", instrumentName: "tenor sax", instrument: "bb" },
].map((a) => ({ ...a, password: DEMO_PASSWORD }) as DemoAccount);

/** A stable UUID-shaped id for a demo row, so re-seeding finds the same rows. */
export function demoId(name: string): string {
  const h = createHash("sha256").update(`pedalpoint-demo:${name}`).digest("hex");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

export const DEMO_BAND_ID = demoId("band");

/** Fixed so the demo looks the same on every machine; a sub's access is set relative to now. */
const CREATED_AT = "2026-09-01T18:00:00.000Z";
const SUB_DAYS = 30;

export interface SeedResult {
  bandId: string;
  usersCreated: number;
  chartsCreated: number;
  /** The demo gig's id (created, or moved to tonight while the band has not edited it). */
  setlistId: string;
}

function inserted(r: { numInsertedOrUpdatedRows?: bigint }[]): number {
  return r.reduce((n, x) => n + Number(x.numInsertedOrUpdatedRows ?? 0n), 0);
}

async function change(trx: Transaction<Database>, entity: string, entityId: string, at = CREATED_AT): Promise<void> {
  await trx
    .insertInto("changes")
    .values({ band_id: DEMO_BAND_ID, entity, entity_id: entityId, op: "upsert", user_id: null, created_at: at })
    .execute();
}

export const DEMO_GIG_ID = demoId("setlist:tonight");

/**
 * Tonight's gig and the sub's live share of it. Dated from `now`: while the band has not edited the
 * gig (revision 1), a later start moves it to that day's evening; once edited, it is the band's own.
 */
async function seedGig(trx: Transaction<Database>, now: Date, leaderId: string, sub: { id: string; email: string } | null): Promise<void> {
  const start = demoGigStart(now).toISOString();
  const end = demoShareEnd(new Date(start)).toISOString();
  const at = now.toISOString();
  const current = await trx.selectFrom("setlists").select(["revision", "starts_at"]).where("id", "=", DEMO_GIG_ID).executeTakeFirst();
  if (current && (current.revision !== 1 || current.starts_at === start)) return;
  if (current) {
    await trx.updateTable("setlists").set({ starts_at: start, updated_at: at }).where("id", "=", DEMO_GIG_ID).execute();
  } else {
    await trx
      .insertInto("setlists")
      .values({
        id: DEMO_GIG_ID, band_id: DEMO_BAND_ID, name: DEMO_GIG.name, starts_at: start, venue: DEMO_BAND.venue, notes: DEMO_GIG.notes,
        set_minutes_json: JSON.stringify(DEMO_GIG.setMinutes), revision: 1, updated_by: leaderId, updated_at: at, deleted_at: null,
      })
      .execute();
    const rows = DEMO_GIG.sets.flatMap((tunes, s) =>
      tunes.map((t, position) => ({
        id: demoId(`entry:tonight:${t.slug}`), setlist_id: DEMO_GIG_ID, band_id: DEMO_BAND_ID, set_number: s + 1, position,
        chart_id: demoId(`chart:${t.slug}`), key: t.key ?? null, tempo: t.tempo ?? null,
        intro_json: t.intro ? JSON.stringify(t.intro) : null, ending: t.ending ? JSON.stringify(t.ending) : null,
        solo_order: t.soloOrder, choruses: t.choruses ?? 1, straight_in: t.straightIn ? 1 : 0, notes: t.notes ?? "",
      })),
    );
    await trx.insertInto("setlist_entries").values(rows).execute();
  }
  await change(trx, "setlist", DEMO_GIG_ID, at);
  if (!sub) return;
  const shareId = demoId("share:tonight");
  await trx.deleteFrom("shares").where("id", "=", shareId).execute();
  await trx
    .insertInto("shares")
    .values({
      id: shareId, band_id: DEMO_BAND_ID, setlist_id: DEMO_GIG_ID, user_id: sub.id, email: sub.email,
      // Already accepted, so no link is ever mailed; the hash only fills the column.
      token_hash: createHash("sha256").update(`pedalpoint-demo:share:${start}`).digest("hex"),
      expires_at: end, created_by: leaderId, created_at: at, revoked_at: null,
    })
    .execute();
}

export async function seedDemo(db: Kysely<Database>, now = new Date()): Promise<SeedResult> {
  const leader = DEMO_ACCOUNTS[0];
  if (!leader) throw new Error("the demo needs a leader");
  // Hash outside the transaction: bcrypt is slow and the transaction holds the only connection.
  const existing = new Set(
    (await db.selectFrom("users").select("email").where("email", "in", DEMO_ACCOUNTS.map((a) => a.email)).execute()).map((u) => u.email),
  );
  const hashes = new Map<string, string>();
  for (const a of DEMO_ACCOUNTS) if (!existing.has(a.email)) hashes.set(a.email, await bcrypt.hash(a.password, 10));
  const charts = DEMO_CHARTS.map((c) => ({ slug: c.slug, text: c.text, chart: parseChartText(c.text) }));

  return db.transaction().execute(async (trx) => {
    let usersCreated = 0;
    for (const a of DEMO_ACCOUNTS) {
      const hash = hashes.get(a.email);
      if (!hash) continue;
      const r = await trx
        .insertInto("users")
        .values({ id: demoId(`user:${a.email}`), email: a.email, name: a.name, password_hash: hash, default_instrument: a.instrument, created_at: CREATED_AT, email_verified_at: CREATED_AT })
        .onConflict((oc) => oc.column("email").doNothing())
        .execute();
      usersCreated += inserted(r);
    }
    const userId = async (email: string) =>
      (await trx.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow()).id;
    const leaderId = await userId(leader.email);

    const band = await trx
      .insertInto("bands")
      .values({ id: DEMO_BAND_ID, name: DEMO_BAND.name, city: DEMO_BAND.city, created_by: leaderId, created_at: CREATED_AT })
      .onConflict((oc) => oc.column("id").doNothing())
      .execute();
    if (inserted(band)) await change(trx, "band", DEMO_BAND_ID);

    for (const a of DEMO_ACCOUNTS) {
      const id = await userId(a.email);
      const expires = a.role === "sub" ? new Date(now.getTime() + SUB_DAYS * 86_400_000).toISOString() : null;
      const r = await trx
        .insertInto("memberships")
        .values({ band_id: DEMO_BAND_ID, user_id: id, role: a.role, instrument: a.instrument, expires_at: expires, created_at: CREATED_AT })
        .onConflict((oc) => oc.columns(["band_id", "user_id"]).doNothing())
        .execute();
      if (inserted(r)) await change(trx, "membership", id);
    }

    const arranger = DEMO_ACCOUNTS.find((a) => a.role === "arranger") ?? leader;
    const arrangerId = await userId(arranger.email);
    let chartsCreated = 0;
    for (const [i, c] of charts.entries()) {
      const id = demoId(`chart:${c.slug}`);
      const author = i % 2 === 0 ? leaderId : arrangerId;
      const at = new Date(Date.parse(CREATED_AT) + (i + 1) * 3_600_000).toISOString();
      const meter = `${c.chart.meter.beats}/${c.chart.meter.unit}`;
      const bodyJson = JSON.stringify(c.chart);
      const r = await trx
        .insertInto("charts")
        .values({
          id,
          band_id: DEMO_BAND_ID,
          title: c.chart.title,
          composer: c.chart.composer,
          concert_key: c.chart.key,
          meter,
          tempo: c.chart.tempo,
          feel: c.chart.feel,
          body_json: bodyJson,
          source_text: c.text,
          revision: 1,
          updated_by: author,
          updated_at: at,
          deleted_at: null,
        })
        .onConflict((oc) => oc.column("id").doNothing())
        .execute();
      if (!inserted(r)) continue;
      chartsCreated++;
      await trx
        .insertInto("chart_revisions")
        .values({
          id: demoId(`revision:${c.slug}:1`),
          chart_id: id,
          band_id: DEMO_BAND_ID,
          revision: 1,
          title: c.chart.title,
          body_json: bodyJson,
          source_text: c.text,
          meta_json: JSON.stringify({ composer: c.chart.composer, key: c.chart.key, meter, tempo: c.chart.tempo, feel: c.chart.feel }),
          message: "Added to the book",
          author_id: author,
          created_at: at,
        })
        .execute();
      await change(trx, "chart", id);
    }
    const subAccount = DEMO_ACCOUNTS.find((a) => a.role === "sub");
    await seedGig(trx, now, leaderId, subAccount ? { id: await userId(subAccount.email), email: subAccount.email } : null);
    return { bandId: DEMO_BAND_ID, usersCreated, chartsCreated, setlistId: DEMO_GIG_ID };
  });
}

/** The demo accounts as a Markdown table (for the README and the start banner). */
export function demoAccountsTable(): string {
  const rows = DEMO_ACCOUNTS.map((a) => `| ${a.email} | ${a.password} | ${a.role} | ${a.instrumentName} (${partName(a.instrument)}) |`);
  return ["| e-mail | password | role | instrument |", "|---|---|---|---|", ...rows].join("\n");
}

function partName(id: DemoAccount["instrument"]): string {
  return { concert: "concert", "concert-bass": "concert, bass clef", bb: "B♭ part", eb: "E♭ part", f: "F part" }[id];
}
