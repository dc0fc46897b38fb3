// Personal marks follow their bar when the leader revises the chart, and are flagged when it is gone.
import { describe, expect, it } from "vitest";
import { ChartSchema, type Chart } from "@/lib/chart/model";
import { anchorFor, MARK_TEXT_MAX, MarkDataSchema, marksByBar, placeAnchor, reanchorMark, readMarkBar, readMarkWords, type MarkData } from "@/lib/setlist";
import { bar, harbourChart } from "./fixture";

function markOn(chart: Chart, section: number, barIndex: number, text = "watch the dim"): MarkData {
  const anchor = anchorFor(chart, section, barIndex);
  if (!anchor) throw new Error("no such bar");
  return MarkDataSchema.parse({ anchor, kind: "text", text, chartRevision: 1 });
}

function revised(mut: (c: Chart) => void): Chart {
  const c = structuredClone(harbourChart());
  mut(c);
  return ChartSchema.parse(c);
}

describe("mark anchors", () => {
  it("anchors by section, occurrence of its label and bar, with the bar's chords", () => {
    const a = anchorFor(harbourChart(), 3, 5);
    expect(a).toEqual({ section: 3, sectionLabel: "A", occurrence: 2, bar: 5, chords: ["Abdim7"] });
    expect(anchorFor(harbourChart(), 9, 0)).toBeNull();
  });

  it("stays put when the revision leaves its bar alone", () => {
    const m = markOn(harbourChart(), 2, 3);
    const next = revised((c) => {
      c.sections[0]!.bars[0] = bar("F6");
    });
    expect(placeAnchor(next, m.anchor)).toEqual({ status: "kept", section: 2, bar: 3 });
  });

  it("follows its section when a section is added before it", () => {
    const m = markOn(harbourChart(), 2, 3); // B section, bar 4 (Bbm6)
    const next = revised((c) => {
      c.sections.unshift({ label: "Verse", bars: [bar("Dm7"), bar("G7")] });
    });
    const r = reanchorMark(next, 2, m);
    expect(r.placement).toEqual({ status: "moved", section: 3, bar: 3 });
    expect(r.data.anchor.section).toBe(3);
    expect(r.data.chartRevision).toBe(2);
    expect(r.data.lost).toBe(false);
  });

  it("follows its bar when a bar is cut before it in the section", () => {
    const m = markOn(harbourChart(), 2, 5); // B bar 6: D7
    const next = revised((c) => {
      c.sections[2]!.bars.splice(1, 1);
    });
    expect(placeAnchor(next, m.anchor)).toEqual({ status: "moved", section: 2, bar: 4 });
  });

  it("keeps the mark on the same bar when only the chords there were rewritten", () => {
    const m = markOn(harbourChart(), 0, 1);
    const next = revised((c) => {
      c.sections[0]!.bars[1] = bar("Bm7b5", "E7");
    });
    expect(placeAnchor(next, m.anchor)).toEqual({ status: "changed", section: 0, bar: 1 });
  });

  it("is flagged lost, not dropped, when its section is gone", () => {
    const m = markOn(harbourChart(), 2, 0);
    const next = revised((c) => {
      c.sections.splice(2, 1);
    });
    const r = reanchorMark(next, 3, m);
    expect(r.placement.status).toBe("lost");
    expect(r.data.lost).toBe(true);
    expect(r.data.text).toBe("watch the dim");
    expect(r.data.anchor).toEqual(m.anchor);
  });

  it("is flagged lost when the section was cut short past its bar", () => {
    const m = markOn(harbourChart(), 1, 7);
    const next = revised((c) => {
      c.sections[1]!.bars = c.sections[1]!.bars.slice(0, 2);
    });
    expect(placeAnchor(next, m.anchor).status).toBe("lost");
  });

  it("tells the renderer which bars carry marks, by the bar's source in the chart", () => {
    const chart = harbourChart();
    const marks = [
      markOn(chart, 1, 2, "breathe"),
      { ...markOn(chart, 1, 2), kind: "highlight" as const, text: "" },
      { ...markOn(chart, 0, 0), anchor: { ...markOn(chart, 0, 0).anchor, sectionLabel: "Coda" } },
    ];
    const byBar = marksByBar(chart, marks);
    expect([...byBar.keys()]).toEqual(["1:2"]);
    expect(byBar.get("1:2")).toEqual({ highlight: true, texts: ["breathe"] });
  });

  it("refuses a text mark with no text", () => {
    const r = MarkDataSchema.safeParse({ ...markOn(harbourChart(), 0, 0), text: "" });
    expect(r.success).toBe(false);
  });
});

describe("item 7: the bar of a personal mark", () => {
  it("refuses a bar number past the end instead of saving it at the last bar", () => {
    expect(readMarkBar("9", 8)).toEqual({ error: "This section has 8 bars: give a bar number from 1 to 8." });
    expect(readMarkBar("0", 8)).toHaveProperty("error");
    expect(readMarkBar("2.5", 8)).toHaveProperty("error");
    expect(readMarkBar("", 8)).toEqual({ error: "Give a bar number from 1 to 8." });
    expect(readMarkBar("8", 8)).toEqual({ bar: 8 });
  });
});

describe("item 7: the words of a personal mark", () => {
  it("says when the words are over the limit instead of cutting them at 60 characters", () => {
    const long = "keep the brushes soft under the singer until the last chorus, then dig in";
    const r = readMarkWords(long);
    expect(r).toEqual({ error: `A mark holds up to ${MARK_TEXT_MAX} characters; this one has ${long.length}. Shorten it to fit over one bar.` });
    expect(readMarkWords("  breathe here ")).toEqual({ text: "breathe here" });
    expect(readMarkWords("x".repeat(MARK_TEXT_MAX))).toEqual({ text: "x".repeat(MARK_TEXT_MAX) });
  });
});
