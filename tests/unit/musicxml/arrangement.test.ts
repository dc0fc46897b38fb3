// Exporting what a player reads: the performance bars of an arrangement (intro, singer's key, tag).
import { describe, expect, it } from "vitest";
import { arrange, parseChartText, type Arrangement } from "@/lib/chart";
import { exportArrangement, importScoreFile, partExportOptions } from "@/lib/musicxml";
import { child, children, parseXml } from "@/lib/musicxml/xml";
import { invalid, validateAll } from "./xmllint";

const chart = parseChartText(`title: Test arrangement
key: F
A:
|: Fmaj7 | D7 | Gm7 | C7 :|
`);
const encode = (s: string) => new TextEncoder().encode(s);

describe("an arrangement exports as the bars a player reads", () => {
  it("with a generated intro in a singer's key, for every part, schema-valid", () => {
    const a = arrange(chart, { instrument: "concert", key: "G", intro: { kind: "two-five" } });
    const docs = Object.fromEntries(["concert", "concert-bass", "bb", "eb", "f"].map((id) => [`${id}.musicxml`, exportArrangement(chart, a, partExportOptions(id))]));
    expect(invalid(validateAll(docs))).toEqual({});
    const back = importScoreFile(encode(docs["concert.musicxml"]!)).chart;
    expect(back.key).toBe("G");
    expect(back.intro?.bars.length).toBe(a.bars.filter((b) => b.part === "intro").length);
    expect(back.sections[0]!.bars.map((b) => b.chords.map((c) => c.symbol))).toEqual([["Gmaj7"], ["E7"], ["Am7"], ["D7"]]);
  });

  it("tagged bars keep their repeat barlines with times=\"M\" (MusicXML 4.0 repeat@times)", () => {
    // The tag as lib/chart's performance bars give it: the last 2 bars again inside repeats, ×3
    const a = arrange(chart, { instrument: "concert" });
    const last = a.bars.slice(-2);
    const tag: Arrangement = {
      ...a,
      bars: [...a.bars, ...last.map((b, i) => ({ ...b, index: a.bars.length + i, section: i === 0 ? "Tag ×3" : null, repeatStart: i === 0, repeatEnd: i === 1, ...(i === 1 ? { repeatTimes: 3 } : {}), barline: i === 1 ? ("final" as const) : ("single" as const) }))],
    };
    const xml = exportArrangement(chart, tag, partExportOptions("bb"));
    expect(invalid(validateAll({ "tag.musicxml": xml }))).toEqual({});
    const ms = children(child(parseXml(xml), "part"), "measure");
    expect(ms).toHaveLength(6);
    expect(xml).toContain("<rehearsal>Tag ×3</rehearsal>");
    expect(child(child(ms[4]!, "barline"), "repeat")?.attrs.direction).toBe("forward");
    const end = children(ms[5]!, "barline").find((b) => b.attrs.location === "right");
    expect(child(end, "repeat")?.attrs).toMatchObject({ direction: "backward", times: "3" });
  });

  it("refuses bars already written for a part (the export transposes)", () => {
    expect(() => exportArrangement(chart, arrange(chart, { instrument: "bb" }))).toThrow(/concert pitch/);
  });
});
