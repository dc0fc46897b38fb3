// Each tune's arrangement is checked against its chart before it goes on the set list.
import { describe, expect, it } from "vitest";
import {
  checkArrangement,
  EndingChoiceSchema,
  endingInWords,
  groupBySet,
  introInWords,
  playOrder,
  renumber,
  SetlistEntrySchema,
  SetlistInputSchema,
} from "@/lib/setlist";
import { entry, harbourChart, kettleChart } from "./fixture";

describe("arrangement validation", () => {
  it("refuses the composed intro on a chart that has none, with a reason and other kinds to try", () => {
    const r = checkArrangement(harbourChart(), { key: null, intro: { kind: "composed" }, ending: null });
    expect(r.ok).toBe(false);
    expect(r.issues[0]?.field).toBe("intro.kind");
    expect(r.issues[0]?.message).toMatch(/no composed intro/);
    expect(r.issues[0]?.message).toMatch(/dominant pedal/);
  });

  it("accepts the composed intro on a chart that has one", () => {
    expect(checkArrangement(kettleChart(), { key: null, intro: { kind: "composed" }, ending: null }).ok).toBe(true);
  });

  it("refuses taking more last bars than the form has", () => {
    // Harbour Lights is 32 bars (AABA, 8 each).
    const r = checkArrangement(harbourChart(), { key: null, intro: { kind: "last-bars", bars: 40 }, ending: null });
    expect(r.issues.map((i) => i.field)).toEqual(["intro.bars"]);
    expect(checkArrangement(harbourChart(), { key: null, intro: { kind: "last-bars", bars: 8 }, ending: null }).ok).toBe(true);
  });

  it("keeps the mode of the tune when a singer's key is set", () => {
    // A minor tune moved for a singer stays minor (common practice: transposing keeps the mode).
    expect(checkArrangement(kettleChart(), { key: "Dm", intro: null, ending: null }).ok).toBe(true);
    const wrong = checkArrangement(kettleChart(), { key: "D", intro: null, ending: null });
    expect(wrong.issues[0]?.field).toBe("key");
    expect(wrong.issues[0]?.message).toMatch(/minor key such as Dm/);
    expect(checkArrangement(harbourChart(), { key: "Gm", intro: null, ending: null }).issues[0]?.message).toMatch(/major key such as G\b/);
  });

  it("refuses a tag longer than the form", () => {
    const r = checkArrangement(kettleChart(), { key: null, intro: null, ending: { kind: "tag", bars: 12, times: 3 } });
    expect(r.issues.map((i) => i.field)).toEqual(["ending.bars"]);
  });

  it("refuses a tune whose chart left the book", () => {
    expect(checkArrangement(null, { key: null, intro: null, ending: null }).issues[0]?.field).toBe("chartId");
  });

  it("passes the intro generator's poor fit on as a warning, not a refusal", () => {
    const r = checkArrangement(harbourChart(), { key: null, intro: { kind: "vamp" }, ending: null }, () => ({
      fits: false,
      advice: "Bar 1 is not the tonic here; a ii–V into the top would lead in better.",
      suggestions: ["two-five"],
    }));
    expect(r.ok).toBe(true);
    expect(r.warnings[0]?.message).toMatch(/ii–V/);
  });
});

describe("set-list shapes", () => {
  it("reads each ending kind of the trade and refuses unknown ones", () => {
    expect(EndingChoiceSchema.parse({ kind: "tag", bars: 4, times: 3 })).toEqual({ kind: "tag", bars: 4, times: 3 });
    expect(EndingChoiceSchema.parse({ kind: "ritardando" })).toEqual({ kind: "ritardando", bars: 2 });
    expect(EndingChoiceSchema.safeParse({ kind: "fade" }).success).toBe(false);
    expect(EndingChoiceSchema.safeParse({ kind: "tag", bars: 4, times: 0 }).success).toBe(false);
  });

  it("names the field of a bad entry", () => {
    const r = SetlistEntrySchema.safeParse({ ...entry("c-1", 1, 0), key: "H" });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(["key"]);
  });

  it("refuses the same entry twice in one set list", () => {
    const e = entry("c-1", 1, 0);
    const r = SetlistInputSchema.safeParse({ name: "Friday", entries: [e, { ...e, position: 1 }] });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(["entries", 1, "id"]);
  });

  it("plays set 1 top to bottom, then set 2", () => {
    const parsed = SetlistInputSchema.parse({
      name: "Friday",
      entries: [entry("b", 2, 0), entry("a2", 1, 1), entry("a1", 1, 0), entry("c", 2, 1)],
    });
    expect(playOrder(parsed.entries).map((e) => e.chartId)).toEqual(["a1", "a2", "b", "c"]);
    expect(groupBySet(parsed.entries).map((s) => s.setNumber)).toEqual([1, 2]);
    expect(renumber(parsed.entries).map((e) => e.position)).toEqual([0, 0, 1, 1]);
  });

  it("says the intro and ending in a few words for the printed list", () => {
    expect(introInWords({ kind: "dominant-pedal", bars: 4 })).toBe("dominant pedal, 4 bars");
    expect(introInWords({ kind: "turnaround", variant: "iii-VI-ii-V", repeats: 2 })).toBe("iii-VI-ii-V turnaround, ×2");
    expect(introInWords(null)).toBe("as written");
    expect(endingInWords({ kind: "tag", bars: 4, times: 3 })).toBe("tag last 4 bars ×3");
    expect(endingInWords({ kind: "cold" })).toBe("cold ending");
  });
});
