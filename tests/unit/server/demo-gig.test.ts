// Item 25: `npm run demo` seeds tonight's gig at the demo venue, with a live share for the demo sub,
// dated from the day the demo starts. Every tune's arrangement passes the same checks as the editor's.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { parseChartText } from "@/lib/chart";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { demoGigStart } from "@/db/demo-gig";
import { DEMO_ACCOUNTS, DEMO_BAND, DEMO_BAND_ID, DEMO_GIG_ID, demoId, seedDemo } from "@/db/seed";
import type { Database } from "@/db/schema";
import { getSetlist } from "@/lib/server/setlists";
import { pullChanges } from "@/lib/server/sync";
import { checkArrangement, groupBySet } from "@/lib/setlist";
import type { WireSetlist } from "@/lib/wire";
import { cleanupDbs, freshDb } from "./helpers";

const NOW = new Date("2026-12-02T09:15:00.000Z");
let db: Kysely<Database>;

async function actorOf(role: string) {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role)!;
  const u = await db.selectFrom("users").selectAll().where("email", "=", a.email).executeTakeFirstOrThrow();
  return { userId: u.id, email: u.email, name: u.name };
}

beforeAll(async () => {
  db = await freshDb();
  await seedDemo(db, NOW);
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

describe("the demo's gig (item 25)", () => {
  let gig: WireSetlist;
  it("is tonight at the demo venue: two sets of 10–12 tunes in all, with the leader's set lengths and a note", async () => {
    gig = await getSetlist(db, await actorOf("leader"), DEMO_BAND_ID, DEMO_GIG_ID, NOW);
    expect(gig.venue).toBe(DEMO_BAND.venue);
    expect(gig.startsAt).toBe("2026-12-02T20:30:00.000Z");
    expect(gig.notes).not.toBe("");
    const sets = groupBySet(gig.entries);
    expect(sets.map((s) => s.setNumber)).toEqual([1, 2]);
    expect(gig.entries.length).toBeGreaterThanOrEqual(10);
    expect(gig.entries.length).toBeLessThanOrEqual(12);
    expect(gig.setMinutes).toEqual([45, 45]);
  });

  it("has a singer's key on two tunes, several intro kinds, a tag and a cold ending, solo orders and a note", () => {
    expect(gig.entries.filter((e) => e.key !== null)).toHaveLength(2);
    expect(new Set(gig.entries.flatMap((e) => (e.intro ? [e.intro.kind] : []))).size).toBeGreaterThanOrEqual(4);
    expect(gig.entries.some((e) => e.ending?.kind === "tag")).toBe(true);
    expect(gig.entries.some((e) => e.ending?.kind === "cold")).toBe(true);
    expect(gig.entries.filter((e) => e.soloOrder !== "").length).toBeGreaterThanOrEqual(8);
    expect(gig.entries.some((e) => e.notes !== "")).toBe(true);
  });

  it("passes the editor's checks on every tune", () => {
    const charts = new Map(DEMO_CHARTS.map((c) => [demoId(`chart:${c.slug}`), parseChartText(c.text)]));
    for (const e of gig.entries) expect(checkArrangement(charts.get(e.chartId) ?? null, e).issues).toEqual([]);
  });

  it("is shared live with the demo sub, whose device receives the gig and its charts", async () => {
    const page = JSON.parse(await pullChanges(db, await actorOf("sub"), DEMO_BAND_ID, { since: 0, limit: 200 }, NOW)) as {
      changes: { entity: string; id: string; op: string }[];
    };
    expect(page.changes.filter((c) => c.entity === "setlist").map((c) => c.id)).toEqual([DEMO_GIG_ID]);
    const charts = new Set(page.changes.filter((c) => c.entity === "chart" && c.op === "upsert").map((c) => c.id));
    expect(charts).toEqual(new Set(gig.entries.map((e) => e.chartId)));
  });

  it("moves to the evening of a later start while the band has not edited it, and never after an edit", async () => {
    expect(demoGigStart(new Date("2026-12-03T01:00:00.000Z")).toISOString()).toBe("2026-12-03T20:30:00.000Z");
    await seedDemo(db, new Date("2026-12-09T10:00:00.000Z"));
    const moved = await db.selectFrom("setlists").select("starts_at").where("id", "=", DEMO_GIG_ID).executeTakeFirstOrThrow();
    expect(moved.starts_at).toBe("2026-12-09T20:30:00.000Z");
    await db.updateTable("setlists").set({ revision: 2 }).where("id", "=", DEMO_GIG_ID).execute();
    await seedDemo(db, new Date("2026-12-12T10:00:00.000Z"));
    const kept = await db.selectFrom("setlists").select("starts_at").where("id", "=", DEMO_GIG_ID).executeTakeFirstOrThrow();
    expect(kept.starts_at).toBe("2026-12-09T20:30:00.000Z");
  });
});
