// The MusicXML download of a set-list entry is tonight's arrangement: the singer's key and the chosen intro.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createChart } from "@/lib/server/charts";
import { exportChartMusicXml } from "@/lib/server/musicxml-export";
import { createSetlist } from "@/lib/server/setlists";
import { importScoreFile } from "@/lib/musicxml";
import { child, numberOf, parseXml } from "@/lib/musicxml/xml";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { invalid, validateAll } from "./xmllint";

let db: Kysely<Database>;
let cast: BandCast;
let chartId: string;
let setlistId: string;
const entryId = randomUUID();

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  chartId = (await createChart(db, cast.arranger, cast.bandId, chartInput())).id;
  const setlist = await createSetlist(db, cast.leader, cast.bandId, {
    name: "Test night",
    entries: [{ id: entryId, chartId, setNumber: 1, position: 0, key: "Eb", intro: { kind: "two-five" }, ending: { kind: "tag", bars: 2, times: 3 } }],
  });
  setlistId = setlist.id;
});
afterAll(cleanupDbs);

describe("exporting a set-list entry", () => {
  it("writes the entry's key and intro, schema-valid, for a B♭ part", async () => {
    const { xml } = await exportChartMusicXml(db, cast.player, cast.bandId, chartId, "bb", { setlistId, entryId });
    expect(invalid(validateAll({ "entry.musicxml": xml }))).toEqual({});
    // concert Eb on a B♭ part is written in F major, 1 flat (REFERENCES.md: a major 2nd above)
    const attrs = child(child(child(parseXml(xml), "part"), "measure"), "attributes");
    expect(numberOf(child(attrs, "key"), "fifths")).toBe(-1);
    const back = importScoreFile(new TextEncoder().encode(xml)).chart;
    expect(back.key).toBe("Eb");
    // the ii–V intro into Ebmaj7 (Fm7 Bb7) comes first, then the form
    expect(back.intro?.bars.flatMap((b) => b.chords.map((c) => c.symbol))).toEqual(["Fm7", "Bb7"]);
    expect(back.sections[0]!.bars[0]!.chords[0]!.symbol).toBe("Ebmaj7");
  });

  it("writes the entry's tag: the form's last 2 bars again, inside repeats played 3 times (MusicXML 4.0 repeat@times)", async () => {
    const { xml } = await exportChartMusicXml(db, cast.player, cast.bandId, chartId, "concert", { setlistId, entryId });
    const measures = child(parseXml(xml), "part")!.children.filter((c) => c.name === "measure");
    // 2 intro bars (ii–V) + the 4-bar form in E♭ + the 2 tag bars
    expect(measures).toHaveLength(8);
    const repeatOf = (m: (typeof measures)[number]) =>
      m.children.filter((c) => c.name === "barline").flatMap((b) => b.children.filter((c) => c.name === "repeat").map((r) => r.attrs));
    expect(repeatOf(measures[6]!)).toEqual([{ direction: "forward" }]);
    expect(repeatOf(measures[7]!)).toEqual([{ direction: "backward", times: "3" }]);
    // the tag repeats the form's last two bars (Cmaj7 Am7 Dm7 G7 in C → Fm7 Bb7 in E♭)
    const back = importScoreFile(new TextEncoder().encode(xml)).chart.sections.flatMap((sec) => sec.bars);
    expect(back.slice(-2).map((b) => b.chords[0]!.symbol)).toEqual(["Fm7", "Bb7"]);
    expect(back[back.length - 1]!.repeatTimes).toBe(3);
  });

  it("an entry that is not this chart's is a 404", async () => {
    const err = await appError(() => exportChartMusicXml(db, cast.player, cast.bandId, chartId, "concert", { setlistId, entryId: randomUUID() }));
    expect(err.status).toBe(404);
  });
});
