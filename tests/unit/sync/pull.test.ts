// The pull side of the sync feed against real SQLite: cursor paging, latest state per entity,
// what each role sees, tombstones, a sub's share ending, a removed member.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createChart, deleteChart, updateChart } from "@/lib/server/charts";
import { recordChange } from "@/lib/server/changes";
import { pullChanges } from "@/lib/server/sync";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { ids, makeSetlist, pull, pullAll, shareWith } from "./helpers";

let db: Kysely<Database>;
let cast: BandCast;
const charts: string[] = [];

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  for (let i = 0; i < 5; i++) {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: `Tune ${i}` }));
    charts.push(c.id);
  }
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

describe("cursor paging", () => {
  it("returns the feed in pages in seq order, `more` until the last page, and nothing after the cursor", async () => {
    const all = await pullAll(db, cast.player, cast.bandId, 0, undefined, 2);
    expect(all.pages.length).toBeGreaterThanOrEqual(3);
    expect(all.pages.slice(0, -1).every((p) => p.more)).toBe(true);
    expect(all.pages.at(-1)?.more).toBe(false);
    const seqs = all.pages.map((p) => p.seq);
    expect([...seqs].sort((a, b) => a - b)).toEqual(seqs);
    expect(ids(all.changes, "chart")).toEqual([...charts].sort());
    const after = await pull(db, cast.player, cast.bandId, { since: all.seq });
    expect(after.changes).toEqual([]);
    expect(after.more).toBe(false);
    expect(after.seq).toBe(all.seq);
  });

  it("counts what is still to come on request, for a first sync's progress", async () => {
    const first = await pull(db, cast.player, cast.bandId, { limit: 2, count: "1" });
    expect(first.total).toBe(5);
    expect(first.changes).toHaveLength(2);
  });

  it("sends each chart once, at its latest revision, however often it changed", async () => {
    const before = await pullAll(db, cast.player, cast.bandId);
    const id = charts[0]!;
    for (let rev = 1; rev <= 3; rev++) await updateChart(db, cast.leader, cast.bandId, id, { ...chartInput({ title: "Tune 0", feel: `take ${rev}` }), baseRevision: rev });
    const delta = await pullAll(db, cast.player, cast.bandId, before.seq);
    expect(delta.changes).toHaveLength(1);
    const c = delta.changes[0]!;
    expect(c.op === "upsert" && c.entity === "chart" ? [c.data.revision, c.data.feel] : null).toEqual([4, "take 3"]);
    // The history list travels with it, newest first.
    expect(c.op === "upsert" && c.entity === "chart" ? c.data.history.map((h) => h.revision) : null).toEqual([4, 3, 2, 1]);
  });

  it("splices the stored chart JSON into the response as it is stored", async () => {
    const row = await db.selectFrom("charts").select(["id", "body_json"]).where("id", "=", charts[1]!).executeTakeFirstOrThrow();
    const text = await pullChanges(db, cast.player, cast.bandId, { since: 0, limit: 100 });
    expect(text).toContain(`"body":${row.body_json}`);
    const parsed = JSON.parse(text) as { changes: { id: string; data?: { body: unknown } }[] };
    expect(parsed.changes.find((c) => c.id === row.id)?.data?.body).toEqual(JSON.parse(row.body_json));
  });
});

describe("tombstones", () => {
  it("turns a deleted chart into a delete change for devices that had it", async () => {
    const c = await createChart(db, cast.arranger, cast.bandId, chartInput({ title: "Short-lived" }));
    const had = await pullAll(db, cast.player, cast.bandId);
    expect(ids(had.changes, "chart")).toContain(c.id);
    await deleteChart(db, cast.arranger, cast.bandId, c.id);
    const delta = await pullAll(db, cast.player, cast.bandId, had.seq);
    expect(delta.changes).toEqual([{ entity: "chart", id: c.id, op: "delete" }]);
  });
});

describe("what each role sees", () => {
  it("gives leaders, arrangers and players the whole book, and only leaders the roster", async () => {
    for (const who of [cast.leader, cast.arranger, cast.player]) {
      const all = await pullAll(db, who, cast.bandId);
      expect(ids(all.changes, "chart")).toEqual([...charts].sort());
    }
    expect((await pull(db, cast.leader, cast.bandId)).members?.map((m) => m.name).sort()).toEqual(["Arranger", "Expired", "Leader", "Player", "Sub"]);
    expect((await pull(db, cast.player, cast.bandId)).members).toBeUndefined();
    expect((await pull(db, cast.player, cast.bandId)).membership.role).toBe("player");
  });

  it("answers outsiders and subs whose access ended with 404", async () => {
    expect((await appError(() => pullChanges(db, cast.outsider, cast.bandId, { since: 0, limit: 10 }))).status).toBe(404);
    expect((await appError(() => pullChanges(db, cast.expiredSub, cast.bandId, { since: 0, limit: 10 }))).status).toBe(404);
    expect((await appError(() => pullChanges(db, null, cast.bandId, { since: 0, limit: 10 }))).status).toBe(401);
  });

  it("sends private rows only to their owner, and a row addressed to one user does not hide others' changes", async () => {
    const mine = await pullAll(db, cast.leader, cast.bandId);
    // A feed row addressed to the sub about chart 2, after a band-wide change of it.
    await updateChart(db, cast.leader, cast.bandId, charts[2]!, { ...chartInput({ title: "Tune 2", feel: "ballad" }), baseRevision: 1 });
    await recordChange(db, { bandId: cast.bandId, entity: "chart", entityId: charts[2]!, op: "upsert", userId: cast.sub.userId });
    await recordChange(db, { bandId: cast.bandId, entity: "annotation", entityId: "mark-of-the-player", op: "upsert", userId: cast.player.userId });
    const delta = await pullAll(db, cast.leader, cast.bandId, mine.seq);
    expect(ids(delta.changes, "chart")).toEqual([charts[2]!]);
    expect(delta.changes.some((c) => c.entity === "annotation")).toBe(false);
  });
});

describe("subs and shares", () => {
  let setlistId: string;
  let shareId: string;

  it("shows a sub nothing of the book without a share", async () => {
    const all = await pullAll(db, cast.sub, cast.bandId);
    expect(all.changes.filter((c) => c.op === "upsert")).toEqual([]);
  });

  it("shows a sub the shared set list and only the charts on it", async () => {
    setlistId = await makeSetlist(db, cast.bandId, cast.leader, [charts[3]!, charts[4]!]);
    shareId = await shareWith(db, cast.bandId, setlistId, cast.sub, cast.leader, new Date(Date.now() + 3_600_000));
    const all = await pullAll(db, cast.sub, cast.bandId);
    expect(ids(all.changes, "chart")).toEqual([charts[3]!, charts[4]!].sort());
    expect(ids(all.changes, "setlist")).toEqual([setlistId]);
    const list = all.changes.find((c) => c.entity === "setlist");
    expect(list?.op === "upsert" && list.entity === "setlist" ? list.data.entries.map((e) => e.chartId) : null).toEqual([charts[3]!, charts[4]!]);
    // The players see the set list too, and still the whole book.
    expect(ids((await pullAll(db, cast.player, cast.bandId)).changes, "setlist")).toEqual([setlistId]);
  });

  it("sends deletes for the shared charts and set list at the first pull after the share ends", async () => {
    const had = await pullAll(db, cast.sub, cast.bandId);
    await db.updateTable("shares").set({ expires_at: new Date(Date.now() - 1000).toISOString() }).where("id", "=", shareId).execute();
    const after = await pullAll(db, cast.sub, cast.bandId, had.seq, had.scope);
    expect(after.scope).not.toBe(had.scope);
    expect(ids(after.changes, "chart", "delete")).toEqual(expect.arrayContaining([charts[3]!, charts[4]!]));
    expect(ids(after.changes, "setlist", "delete")).toEqual([setlistId]);
    expect(ids(after.changes, "chart")).toEqual([]);
    // And the pull after that has nothing more to say.
    const again = await pullAll(db, cast.sub, cast.bandId, after.seq, after.scope);
    expect(again.changes).toEqual([]);
  });

  it("treats a withdrawn share the same way", async () => {
    await db.updateTable("shares").set({ expires_at: new Date(Date.now() + 3_600_000).toISOString() }).where("id", "=", shareId).execute();
    const had = await pullAll(db, cast.sub, cast.bandId);
    expect(ids(had.changes, "chart")).toHaveLength(2);
    await db.updateTable("shares").set({ revoked_at: new Date().toISOString() }).where("id", "=", shareId).execute();
    const after = await pullAll(db, cast.sub, cast.bandId, had.seq, had.scope);
    expect(ids(after.changes, "chart", "delete")).toEqual(expect.arrayContaining([charts[3]!, charts[4]!]));
  });
});

describe("a removed member", () => {
  it("gets 404, which tells the device to delete the band's data", async () => {
    const before = await pull(db, cast.arranger, cast.bandId);
    expect(before.changes.length).toBeGreaterThan(0);
    await db.deleteFrom("memberships").where("band_id", "=", cast.bandId).where("user_id", "=", cast.arranger.userId).execute();
    expect((await appError(() => pullChanges(db, cast.arranger, cast.bandId, { since: 0, limit: 10 }))).status).toBe(404);
  });
});
