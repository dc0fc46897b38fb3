// One wire shape per entity (lib/wire.ts): what the routes answer and what the sync feed carries
// both read with the same schemas, so the device stores either without converting it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createMark } from "@/lib/server/marks";
import { createChart, getChart } from "@/lib/server/charts";
import { listMembers } from "@/lib/server/members";
import { getSetlist } from "@/lib/server/setlists";
import { WireChartSchema, WireMarkSchema, WireMemberSchema, WireSetlistSchema } from "@/lib/wire";
import { chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { makeSetlist, pull, pullAll } from "./helpers";

let db: Kysely<Database>;
let cast: BandCast;
let chartId: string;
let setlistId: string;

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  chartId = (await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Slipway Lights", key: "Eb" }))).id;
  setlistId = await makeSetlist(db, cast.bandId, cast.leader, [chartId]);
  const anchor = { section: 0, sectionLabel: "A", occurrence: 0, bar: 0, chords: [] };
  await createMark(db, cast.leader, cast.bandId, { chartId, data: { anchor, kind: "highlight", chartRevision: 1 } });
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

describe("the wire shapes", () => {
  it("a chart from the route and from the feed is the same shape, and the same value but for the history list", async () => {
    const fromRoute = WireChartSchema.strict().parse(await getChart(db, cast.leader, cast.bandId, chartId));
    const feed = await pullAll(db, cast.leader, cast.bandId);
    const change = feed.changes.find((c) => c.entity === "chart" && c.id === chartId);
    const fromFeed = WireChartSchema.strict().parse(change?.data);
    expect(fromRoute.key).toBe("Eb");
    expect(fromRoute.updatedBy).toEqual({ id: cast.leader.userId, name: cast.leader.name });
    expect({ ...fromFeed, history: undefined }).toEqual({ ...fromRoute, history: undefined });
    expect(fromFeed.history?.map((h) => h.revision)).toEqual([1]);
  });

  it("a set list, a mark and the roster from the feed read with the same schemas as the routes' answers", async () => {
    const feed = await pullAll(db, cast.leader, cast.bandId);
    const setlist = WireSetlistSchema.strict().parse(feed.changes.find((c) => c.entity === "setlist")?.data);
    expect(setlist).toEqual(WireSetlistSchema.strict().parse(await getSetlist(db, cast.leader, cast.bandId, setlistId)));
    expect(WireMarkSchema.strict().parse(feed.changes.find((c) => c.entity === "annotation")?.data).chartId).toBe(chartId);
    const roster = WireMemberSchema.strict().array().parse((await pull(db, cast.leader, cast.bandId)).members);
    expect(roster).toEqual(WireMemberSchema.strict().array().parse(await listMembers(db, cast.leader, cast.bandId)));
  });
});
