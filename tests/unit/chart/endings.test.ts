// Endings played on several passes: `[1,2` in chart text, MusicXML <ending number="1, 2">.
import { describe, expect, it } from "vitest";
import { arrange, lastPassBars, parseChartText, serializeChart } from "@/lib/chart";
import { ChartTextError } from "@/lib/chart/text-error";
import { barsAsPlayed, playingOrder } from "@/lib/chart/as-played";
import { endingLabel, parseEndingPasses } from "@/lib/chart/endings";
import { playedBars } from "@/lib/accompaniment/as-played";
import { barsPlayedCount } from "@/lib/setlist";
import { layoutChart } from "@/lib/render/layout";

// Invented 8-bar tune: a repeat taken three times, the first ending for passes 1 and 2, the second for pass 3.
const TEXT = ["title: Harbour Lamps", "key: F", "time: 4/4", "", "A:", "|: F6 | Gm7 C7 | [1,2 Am7 D7 | Gm7 C7 :|x3", "| [3 F6 | F6 ]"].join("\n");

describe("an ending for several passes", () => {
  it("is read from chart text as one ending on passes 1 and 2", () => {
    const bars = parseChartText(TEXT).sections[0]!.bars;
    expect(bars.map((b) => b.ending)).toEqual([null, null, 1, 1, 3, 3]);
    expect(bars.map((b) => b.endingPasses ?? null)).toEqual([null, null, [1, 2], [1, 2], null, null]);
  });

  it("is written back as [1,2 and reads the same", () => {
    const chart = parseChartText(TEXT);
    const text = serializeChart(chart);
    expect(text).toContain("[1,2 Am7 D7");
    expect(parseChartText(text)).toEqual(chart);
  });

  it("is played on both passes (common practice: a volta numbered \"1, 2.\" is taken the first and second time)", () => {
    const bars = parseChartText(TEXT).sections[0]!.bars;
    // passes 1 and 2 play bars 1–4; pass 3 plays bars 1–2 and the 3rd ending
    expect(playingOrder(bars)).toEqual([0, 1, 2, 3, 0, 1, 2, 3, 0, 1, 4, 5]);
    expect(barsAsPlayed(bars)).toHaveLength(12);
    expect(barsPlayedCount(bars)).toBe(12);
  });

  it("is skipped on the last time through, so the last bars are the 3rd ending's", () => {
    const last = lastPassBars(parseChartText(TEXT));
    expect(last.map((b) => b.chords.map((c) => c.symbol).join(" "))).toEqual(["F6", "Gm7 C7", "F6", "F6"]);
  });

  it("keeps its passes into the part a player reads and into playback", () => {
    const arr = arrange(parseChartText(TEXT), { instrument: "bb" });
    expect(arr.bars[2]!.endingPasses).toEqual([1, 2]);
    expect(playedBars(arr.bars).map((b) => b.index)).toEqual([0, 1, 2, 3, 0, 1, 2, 3, 0, 1, 4, 5]);
  });

  it("is labelled \"1, 2.\" on the bracket, and the first chord clears the wider label", () => {
    const arr = arrange(parseChartText(TEXT));
    expect(endingLabel(arr.bars[2]!)).toBe("1, 2.");
    expect(endingLabel(arr.bars[4]!)).toBe("3.");
    const layout = layoutChart(arr, { width: 1024, height: 768 });
    const placed = layout.pages.flatMap((p) => p.systems.flatMap((s) => s.bars));
    const shared = placed.find((b) => b.bar.index === 2)!;
    const single = placed.find((b) => b.bar.index === 4)!;
    expect(shared.endingStart).toBe(true);
    expect(placed.find((b) => b.bar.index === 3)!.endingStart).toBe(false);
    // the label "1, 2." is wider than "3.", so the chord starts further into its bar
    expect(shared.chords[0]!.x - shared.endingX).toBeGreaterThan(single.chords[0]!.x - single.endingX);
  });

  it("names its passes in rising order, else the text is refused at the bracket", () => {
    const bad = TEXT.replace("[1,2", "[2,1");
    expect(() => parseChartText(bad)).toThrow(ChartTextError);
    try {
      parseChartText(bad);
    } catch (e) {
      expect((e as ChartTextError).message).toMatch(/rising order/);
      expect((e as ChartTextError).line).toBe(6);
    }
  });

  it("needs the :| before the next pass's ending", () => {
    const bad = TEXT.replace("Gm7 C7 :|x3", "Gm7 C7 ] |").replace("|: F6", "|: F6");
    expect(() => parseChartText(bad)).toThrow(/Ending \[1,2 must end with :\|/);
  });

  it("parses MusicXML ending numbers as the standard writes them", () => {
    // MusicXML 4.0 ending-number: "1", "1, 2", "1,2" (comma-separated, optional space)
    expect(parseEndingPasses("1")).toEqual([1]);
    expect(parseEndingPasses("1, 2")).toEqual([1, 2]);
    expect(parseEndingPasses("2,1")).toEqual([1, 2]);
    expect(parseEndingPasses("")).toBeNull();
    expect(parseEndingPasses("9")).toBeNull();
  });
});
