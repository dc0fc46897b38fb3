// Item 19: deleting and archiving a chart. An archived chart leaves the players' books through the sync
// feed and the plan's chart count, and a leader or arranger can bring it back; a player cannot.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { planUsage } from "@/lib/server/billing";
import { archiveChart, bringBackChart, deleteArchivedChart, listArchivedCharts } from "@/lib/server/chart-archive";
import { createChart, deleteChart, listCharts } from "@/lib/server/charts";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { ids, pull } from "../sync/helpers";

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

describe("delete and archive a chart (item 19)", () => {
  it("archiving takes the chart out of the book, the plan's count and the player's device, and keeps it for the leader", async () => {
    const keep = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Gull Point Shuffle" }));
    const away = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Saltpan Ballad" }));
    const before = await planUsage(db, cast.bandId);
    const seen = await pull(db, cast.player, cast.bandId, {});
    expect(ids(seen.changes, "chart")).toContain(away.id);

    await archiveChart(db, cast.arranger, cast.bandId, away.id);

    expect((await listCharts(db, cast.player, cast.bandId)).map((c) => c.id)).toEqual([keep.id]);
    expect((await planUsage(db, cast.bandId)).charts).toBe(before.charts - 1);
    const after = await pull(db, cast.player, cast.bandId, { since: seen.seq });
    expect(ids(after.changes, "chart", "delete")).toEqual([away.id]);
    const archived = await listArchivedCharts(db, cast.leader, cast.bandId);
    expect(archived.map((c) => c.title)).toEqual(["Saltpan Ballad"]);
  });

  it("only a leader or arranger sees the archive and brings a chart back; it returns to the player's device", async () => {
    const [held] = await listArchivedCharts(db, cast.leader, cast.bandId);
    const seen = await pull(db, cast.player, cast.bandId, {});
    expect(await appError(() => listArchivedCharts(db, cast.player, cast.bandId))).toMatchObject({ code: "forbidden" });
    expect(await appError(() => bringBackChart(db, cast.player, cast.bandId, held!.id))).toMatchObject({ code: "forbidden" });

    await bringBackChart(db, cast.leader, cast.bandId, held!.id);

    expect((await listCharts(db, cast.player, cast.bandId)).map((c) => c.title).sort()).toEqual(["Gull Point Shuffle", "Saltpan Ballad"]);
    expect(ids((await pull(db, cast.player, cast.bandId, { since: seen.seq })).changes, "chart")).toEqual([held!.id]);
    expect(await listArchivedCharts(db, cast.leader, cast.bandId)).toEqual([]);
  });

  it("a deleted chart is not in the archive; an archived one can be deleted for good", async () => {
    const gone = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Breakwater Blues" }));
    await deleteChart(db, cast.leader, cast.bandId, gone.id);
    expect(await listArchivedCharts(db, cast.leader, cast.bandId)).toEqual([]);
    expect(await appError(() => bringBackChart(db, cast.leader, cast.bandId, gone.id))).toMatchObject({ code: "not_found" });

    const old = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Ropewalk" }));
    await archiveChart(db, cast.leader, cast.bandId, old.id);
    await deleteArchivedChart(db, cast.leader, cast.bandId, old.id);
    expect(await listArchivedCharts(db, cast.leader, cast.bandId)).toEqual([]);
    expect((await listCharts(db, cast.leader, cast.bandId)).map((c) => c.title)).not.toContain("Ropewalk");
  });
});
