// Item 24: how long each tune and each set runs. Every expected figure is worked by hand from
// bars × beats per bar × 60 / tempo (arithmetic), with the form counted as played, repeats taken.
// Head in, each soloist's choruses, head out: common practice for a jazz tune on a gig.
import { describe, expect, it } from "vitest";
import { ChartSchema, type Bar, type Chart } from "@/lib/chart/model";
import {
  barsPlayedCount, formatTuneLength, SetlistEntrySchema, setLengthInWords, setTiming, soloistCount, tuneTiming,
  type SetlistEntry,
} from "@/lib/setlist";
import { bar, harbourChart, kettleChart } from "./fixture";

function marked(b: Bar, patch: Partial<Bar>): Bar {
  return { ...b, ...patch };
}

/** An invented 24-bar-as-written AABA: |: A (8) :| B (8) A (8) → 32 bars as played. */
function repeatedChart(tempo: number | null): Chart {
  const a = Array.from({ length: 8 }, () => bar("Gm7"));
  a[0] = marked(a[0]!, { repeatStart: true });
  a[7] = marked(a[7]!, { repeatEnd: true });
  return ChartSchema.parse({
    title: "Tidewater Steps",
    key: "Bb",
    meter: { beats: 4, unit: 4 },
    tempo,
    sections: [
      { label: "A", bars: a },
      { label: "B", bars: Array.from({ length: 8 }, () => bar("Ebmaj7")) },
      { label: "A", bars: Array.from({ length: 8 }, () => bar("Gm7")) },
    ],
  });
}

function entryOf(patch: Partial<SetlistEntry> = {}): SetlistEntry {
  return SetlistEntrySchema.parse({ id: "6f1e3c1a-0000-4000-8000-000000000001", chartId: "c1", setNumber: 1, position: 0, ...patch });
}

describe("bars as played", () => {
  it("takes a repeat: 8 bars inside |: :| then 16 more are 32 bars", () => {
    expect(barsPlayedCount(repeatedChart(160).sections.flatMap((s) => s.bars))).toBe(32);
  });

  it("plays the 1st ending the first time and the 2nd ending the second: |: 6 [1 2 :| [2 2 | = 6+2+6+2 = 16", () => {
    const bars = Array.from({ length: 10 }, () => bar("C7"));
    bars[0] = marked(bars[0]!, { repeatStart: true });
    bars[6] = marked(bars[6]!, { ending: 1 });
    bars[7] = marked(bars[7]!, { ending: 1, repeatEnd: true });
    bars[8] = marked(bars[8]!, { ending: 2 });
    bars[9] = marked(bars[9]!, { ending: 2 });
    expect(barsPlayedCount(bars)).toBe(16);
  });

  it("takes :|x3 three times through: 4 bars → 12", () => {
    const bars = Array.from({ length: 4 }, () => bar("F7"));
    bars[3] = marked(bars[3]!, { repeatEnd: true, repeatTimes: 3 });
    expect(barsPlayedCount(bars)).toBe(12);
  });
});

describe("set durations (item 24)", () => {
  it("counts the soloists in a solo order", () => {
    expect(soloistCount("tenor, piano, bass")).toBe(3);
    expect(soloistCount("trumpet & alto / drums")).toBe(3);
    expect(soloistCount("  ")).toBe(0);
  });

  it("a 32-bar form at 160 with two soloists, one chorus each: 4 × 32 × 4 × 60 / 160 = 192 s", () => {
    const t = tuneTiming(repeatedChart(160), entryOf({ soloOrder: "tenor, piano" }));
    expect(t.formBars).toBe(32);
    expect(t.choruses).toBe(4); // head in, 2 solos, head out
    expect(t.seconds).toBe(192);
    expect(formatTuneLength(t.seconds!)).toBe("3:12");
  });

  it("choruses per soloist multiply the solos: 2 soloists × 2 choruses + 2 heads = 6 × 32 × 4 × 60 / 160 = 288 s", () => {
    expect(tuneTiming(repeatedChart(160), entryOf({ soloOrder: "tenor, piano", choruses: 2 })).seconds).toBe(288);
  });

  it("tonight's tempo wins over the chart's: one soloist is 3 × 32 = 96 bars; 96 × 4 × 60 / 120 = 192 s", () => {
    expect(tuneTiming(repeatedChart(160), entryOf({ tempo: 120, soloOrder: "alto" })).seconds).toBe(192);
  });

  it("adds the chart's own intro and a tag: 2 + 8 × 3 + 4 × 3 = 38 bars; 38 × 4 × 60 / 120 = 76 s", () => {
    const kettle = { ...kettleChart(), tempo: 120 }; // 8-bar form, 2-bar composed intro
    const t = tuneTiming(kettle, entryOf({ soloOrder: "piano", ending: { kind: "tag", bars: 4, times: 3 } }));
    expect(t.introBars).toBe(2);
    expect(t.endingBars).toBe(12);
    expect(t.totalBars).toBe(38);
    expect(t.seconds).toBe(76);
  });

  it("straight in at the top drops the chart's own intro: 24 bars × 4 × 60 / 120 = 48 s", () => {
    const kettle = { ...kettleChart(), tempo: 120 };
    expect(tuneTiming(kettle, entryOf({ soloOrder: "piano", straightIn: true })).seconds).toBe(48);
  });

  it("a chosen 4-bar dominant pedal adds 4 bars: (4 + 32) × 4 × 60 / 160 = 54 s with the head once", () => {
    const t = tuneTiming(harbourChart(), entryOf({ tempo: 160, intro: { kind: "dominant-pedal", bars: 4 } }));
    expect(t.introBars).toBe(4);
    expect(t.seconds).toBe(54);
  });

  it("a cold ending adds nothing; no tempo anywhere leaves the tune untimed", () => {
    const t = tuneTiming(repeatedChart(null), entryOf({ ending: { kind: "cold" } }));
    expect(t.endingBars).toBe(0);
    expect(t.seconds).toBeNull();
    expect(setTiming([{ seconds: 192 }, t, { seconds: 288 }])).toEqual({ seconds: 480, untimed: 1 });
  });

  it("shows the set against the leader's length: 2820 s is 47 min of 45", () => {
    expect(setLengthInWords(1, 2820, 45)).toBe("Set 1: 47 min of 45");
    expect(setLengthInWords(2, 2820, null)).toBe("Set 2: 47 min");
  });
});
