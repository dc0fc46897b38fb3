// Publishing, conflicts, history and tombstones of the chart library.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createChart, deleteChart, getChart, listCharts, listRevisions, restoreRevision, updateChart } from "@/lib/server/charts";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "./helpers";
import type { WireChart } from "@/lib/wire";

let db: Kysely<Database>;
let cast: BandCast;
beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

async function changesFor(chartId: string) {
  return db.selectFrom("changes").selectAll().where("entity", "=", "chart").where("entity_id", "=", chartId).orderBy("seq").execute();
}

describe("publishing a chart", () => {
  it("stores the text as written and the parsed chart, with the form's metadata winning over the text's", async () => {
    const text = "title: Text Title\nkey: G\ntime: 3/4\ntempo: 90\n\nA:\n| Cmaj7 | Am7 | Dm7 | G7 |\n";
    const chart = await createChart(db, cast.arranger, cast.bandId, chartInput({ sourceText: text, title: "Form Title", key: "C", meter: "4/4", tempo: 132 }));
    expect(chart.sourceText).toBe(text);
    expect(chart.body.title).toBe("Form Title");
    expect(chart.body.key).toBe("C");
    expect(chart.body.meter).toEqual({ beats: 4, unit: 4 });
    expect(chart.body.tempo).toBe(132);
    expect(chart.body.sections[0]?.bars).toHaveLength(4);
    const row = await db.selectFrom("charts").selectAll().where("id", "=", chart.id).executeTakeFirstOrThrow();
    expect(JSON.parse(row.body_json)).toEqual(chart.body);
    expect(row.source_text).toBe(text);
    expect(row.concert_key).toBe("C");
  });

  it("writes revision 1 and one change on create, then one of each per update", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput());
    expect(chart.revision).toBe(1);
    expect(await changesFor(chart.id)).toHaveLength(1);
    const v2 = await updateChart(db, cast.arranger, cast.bandId, chart.id, { ...chartInput({ title: "Second Take" }), baseRevision: 1, message: "New title" });
    expect(v2.revision).toBe(2);
    expect(v2.updatedBy.name).toBe(cast.arranger.name);
    const revs = await listRevisions(db, cast.player, cast.bandId, chart.id);
    expect(revs.map((r) => [r.revision, r.title, r.author.name, r.message])).toEqual([
      [2, "Second Take", cast.arranger.name, "New title"],
      [1, "Test Tune", cast.leader.name, "Created the chart"],
    ]);
    const changes = await changesFor(chart.id);
    expect(changes.map((c) => c.op)).toEqual(["upsert", "upsert"]);
    expect(changes.every((c) => c.band_id === cast.bandId)).toBe(true);
  });

  it("a failed write leaves no revision and no change behind", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput());
    await appError(() => updateChart(db, cast.leader, cast.bandId, chart.id, { ...chartInput({ sourceText: "A:\n| Qzz9 |\n" }), baseRevision: 1 }));
    expect(await changesFor(chart.id)).toHaveLength(1);
    expect((await listRevisions(db, cast.leader, cast.bandId, chart.id)).length).toBe(1);
  });
});

describe("revision conflicts", () => {
  it("the second editor of one revision gets 409 with the chart as it now stands", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput());
    await updateChart(db, cast.leader, cast.bandId, chart.id, { ...chartInput({ title: "Leader's fix" }), baseRevision: 1 });
    const err = await appError(() => updateChart(db, cast.arranger, cast.bandId, chart.id, { ...chartInput({ title: "Arranger's fix" }), baseRevision: 1 }));
    expect(err.status).toBe(409);
    const current = err.details?.current as WireChart;
    expect(current.revision).toBe(2);
    expect(current.title).toBe("Leader's fix");
    expect(current.updatedBy.name).toBe(cast.leader.name);
    expect(err.message).toContain(cast.leader.name);
    // Nothing of the losing edit was written.
    expect((await getChart(db, cast.leader, cast.bandId, chart.id)).title).toBe("Leader's fix");
    expect(await changesFor(chart.id)).toHaveLength(2);
  });

  it("two edits racing on one revision: exactly one wins", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput());
    const results = await Promise.allSettled([
      updateChart(db, cast.leader, cast.bandId, chart.id, { ...chartInput({ title: "One" }), baseRevision: 1 }),
      updateChart(db, cast.arranger, cast.bandId, chart.id, { ...chartInput({ title: "Two" }), baseRevision: 1 }),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect((await getChart(db, cast.player, cast.bandId, chart.id)).revision).toBe(2);
  });

  it("editing a chart someone deleted is a conflict that shows the deletion", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput());
    await deleteChart(db, cast.leader, cast.bandId, chart.id);
    const err = await appError(() => updateChart(db, cast.arranger, cast.bandId, chart.id, { ...chartInput(), baseRevision: 1 }));
    expect(err.status).toBe(409);
    expect((err.details?.current as WireChart).deletedAt).not.toBeNull();
  });
});

describe("deleting and restoring", () => {
  it("a delete is a tombstone: gone from the list, kept in the table, a delete change recorded", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Doomed" }));
    const del = await deleteChart(db, cast.arranger, cast.bandId, chart.id);
    expect(del.revision).toBe(2);
    expect((await listCharts(db, cast.leader, cast.bandId)).map((c) => c.id)).not.toContain(chart.id);
    expect((await listCharts(db, cast.leader, cast.bandId, { includeDeleted: true })).map((c) => c.id)).toContain(chart.id);
    expect((await appError(() => getChart(db, cast.leader, cast.bandId, chart.id))).status).toBe(404);
    expect((await changesFor(chart.id)).map((c) => c.op)).toEqual(["upsert", "delete"]);
    expect((await appError(() => deleteChart(db, cast.leader, cast.bandId, chart.id))).status).toBe(404);
  });

  it("restoring an old revision publishes it as a new revision, and brings a deleted chart back", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Original" }));
    await updateChart(db, cast.leader, cast.bandId, chart.id, { ...chartInput({ title: "Changed", key: "Eb" }), baseRevision: 1 });
    await deleteChart(db, cast.leader, cast.bandId, chart.id);
    const back = await restoreRevision(db, cast.arranger, cast.bandId, chart.id, 1);
    expect(back.revision).toBe(4);
    expect(back.title).toBe("Original");
    expect(back.key).toBe("C");
    expect(back.deletedAt).toBeNull();
    const revs = await listRevisions(db, cast.leader, cast.bandId, chart.id);
    expect(revs[0]?.message).toBe("Restored revision 1");
    expect((await appError(() => restoreRevision(db, cast.leader, cast.bandId, chart.id, 99))).status).toBe(404);
  });

  it("a chart of another band is not found through this band", async () => {
    const other = await makeBand(db);
    const chart = await createChart(db, other.leader, other.bandId, chartInput());
    // The leader of our band asks for the other band's chart under our band id.
    expect((await appError(() => getChart(db, cast.leader, cast.bandId, chart.id))).status).toBe(404);
    expect((await appError(() => updateChart(db, cast.leader, cast.bandId, chart.id, { ...chartInput(), baseRevision: 1 }))).status).toBe(404);
  });
});
