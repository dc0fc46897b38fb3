// The demo seed: every demo chart reads, the demo covers what the demo promises, and seeding twice
// changes nothing.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import bcrypt from "bcryptjs";
import type { Kysely } from "kysely";
import { parseChartText } from "@/lib/chart";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { DEMO_ACCOUNTS, DEMO_BAND_ID, DEMO_GIG_ID, demoAccountsTable, seedDemo } from "@/db/seed";
import type { Database } from "@/db/schema";
import { listCharts } from "@/lib/server/charts";
import { cleanupDbs, freshDb } from "./helpers";

let db: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb();
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

describe("demo charts", () => {
  for (const c of DEMO_CHARTS) {
    it(`${c.slug} parses`, () => {
      const chart = parseChartText(c.text);
      expect(chart.sections.length).toBeGreaterThan(0);
    });
  }

  it("cover the forms, keys and meters the demo promises", () => {
    const charts = DEMO_CHARTS.map((c) => ({ covers: c.covers, chart: parseChartText(c.text) }));
    expect(charts.length).toBeGreaterThanOrEqual(12);
    const covered = new Set(charts.flatMap((c) => c.covers));
    for (const need of ["AABA", "ABAC", "12-bar blues", "minor blues", "starts away from the tonic", "major", "minor", "4/4", "3/4"]) {
      expect(covered, need).toContain(need);
    }
    expect(charts.filter((c) => c.chart.intro !== null).length).toBeGreaterThanOrEqual(2);
    expect(charts.some((c) => c.chart.meter.beats === 3)).toBe(true);
    expect(charts.some((c) => c.chart.key.endsWith("m"))).toBe(true);
    // The render checks need a concert-E♭ chart with a B♭7sus4 bar.
    const eb = charts.find((c) => c.chart.key === "Eb");
    const symbols = [eb?.chart.intro, ...(eb?.chart.sections ?? [])].flatMap((s) => s?.bars ?? []).flatMap((b) => b.chords.map((x) => x.symbol));
    expect(symbols.some((s) => /^Bb7sus4?$/.test(s))).toBe(true);
    // Titles are all different.
    expect(new Set(charts.map((c) => c.chart.title)).size).toBe(charts.length);
  });
});

describe("demo accounts", () => {
  it("cover all four roles and the band's instruments", () => {
    expect(DEMO_ACCOUNTS.length).toBeGreaterThanOrEqual(6);
    expect(new Set(DEMO_ACCOUNTS.map((a) => a.role))).toEqual(new Set(["leader", "arranger", "player", "sub"]));
    const parts = Object.fromEntries(DEMO_ACCOUNTS.map((a) => [a.instrumentName, a.instrument]));
    // Written pitch per instrument: MusicXML 4.0 <transpose> (see REFERENCES.md); piano, drums, voice read concert.
    expect(parts).toEqual({
      trumpet: "bb",
      "alto sax": "eb",
      "tenor sax": "bb",
      trombone: "concert-bass",
      piano: "concert",
      bass: "concert-bass",
      drums: "concert",
      voice: "concert",
    });
  });

  it("print as a table with e-mail, password, role and instrument", () => {
    const table = demoAccountsTable().split("\n");
    expect(table[0]).toBe("| e-mail | password | role | instrument |");
    expect(table).toHaveLength(DEMO_ACCOUNTS.length + 2);
  });
});

describe("seedDemo", () => {
  it("creates the band, its members and its book with a revision and a change per chart", async () => {
    const r = await seedDemo(db);
    expect(r).toEqual({ bandId: DEMO_BAND_ID, usersCreated: DEMO_ACCOUNTS.length, chartsCreated: DEMO_CHARTS.length, setlistId: DEMO_GIG_ID });
    const leader = DEMO_ACCOUNTS.find((a) => a.role === "leader");
    const row = await db.selectFrom("users").selectAll().where("email", "=", leader?.email ?? "").executeTakeFirstOrThrow();
    expect(await bcrypt.compare(leader?.password ?? "", row.password_hash ?? "")).toBe(true);
    const charts = await listCharts(db, { userId: row.id, email: row.email, name: row.name }, DEMO_BAND_ID);
    expect(charts).toHaveLength(DEMO_CHARTS.length);
    expect(await db.selectFrom("chart_revisions").select("id").where("band_id", "=", DEMO_BAND_ID).execute()).toHaveLength(DEMO_CHARTS.length);
    const subs = await db.selectFrom("memberships").selectAll().where("role", "=", "sub").execute();
    expect(subs.every((s) => s.expires_at !== null && s.expires_at > new Date().toISOString())).toBe(true);
  });

  it("is idempotent: a second run adds nothing and keeps edits", async () => {
    const count = async () => ({
      users: (await db.selectFrom("users").select("id").execute()).length,
      charts: (await db.selectFrom("charts").select("id").execute()).length,
      revisions: (await db.selectFrom("chart_revisions").select("id").execute()).length,
      changes: (await db.selectFrom("changes").select("seq").execute()).length,
      members: (await db.selectFrom("memberships").select("user_id").execute()).length,
    });
    await db.updateTable("charts").set({ title: "Edited by the band" }).where("band_id", "=", DEMO_BAND_ID).where("title", "=", "Coal Barge").execute();
    const before = await count();
    const r = await seedDemo(db);
    expect(r.usersCreated).toBe(0);
    expect(r.chartsCreated).toBe(0);
    expect(await count()).toEqual(before);
    expect((await db.selectFrom("charts").select("id").where("title", "=", "Edited by the band").execute()).length).toBe(1);
  });
});
