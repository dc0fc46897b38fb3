// Issue 16 item 7: a player's mark words are laid out in a lane of their own under the staff, wrapped
// inside their bar, so they never sit on the chord symbols or the ending bracket above the staff.
import { describe, expect, it } from "vitest";
import { layoutChart } from "@/lib/render/layout";
import { MARK_FONT_SIZE, MARK_LANE_DROP, wrapMarkWords } from "@/lib/render/marks";
import { STAFF_HEIGHT, textWidth } from "@/lib/render/metrics";
import type { ChartLayout, System } from "@/lib/render/types";
import { arrangement } from "./fixtures";

const PHONE = { width: 390, height: 844 };
const LAPTOP = { width: 1280, height: 800 };

/** 16 bars, each placed in the chart as section 0, bar i (the key marks use). */
function sourced() {
  const a = arrangement(16);
  return { ...a, bars: a.bars.map((b, i) => ({ ...b, source: { section: 0, bar: i } })) };
}

const LONG = "watch the horns here, lay out till the bridge";

function systems(layout: ChartLayout): System[] {
  return layout.pages.flatMap((p) => p.systems);
}

describe("item 7: mark words get a lane of their own, wrapped", () => {
  it("wraps at word breaks to the given width, breaking only a word too long for a line", () => {
    const lines = wrapMarkWords(LONG, 120);
    expect(lines.join(" ")).toBe(LONG);
    expect(lines.length).toBeGreaterThan(1);
    for (const line of lines) expect(textWidth(line, MARK_FONT_SIZE)).toBeLessThanOrEqual(120);
    const word = "x".repeat(40);
    const pieces = wrapMarkWords(word, 60);
    expect(pieces.join("")).toBe(word);
    for (const p of pieces) expect(textWidth(p, MARK_FONT_SIZE)).toBeLessThanOrEqual(60);
  });

  for (const [name, size] of [["a 390 px phone", PHONE], ["a laptop", LAPTOP]] as const) {
    it(`puts the words under the staff of their bar, inside the bar, on ${name}`, () => {
      const marks = new Map([["0:5", { texts: [LONG] }]]);
      const layout = layoutChart(sourced(), { ...size, marks });
      const system = systems(layout).find((s) => s.bars.some((b) => b.bar.index === 5))!;
      const placed = system.bars.find((b) => b.bar.index === 5)!;
      expect(system.markLaneY).toBe(system.staffY + MARK_LANE_DROP);
      // Below the staff and its direction line; chord symbols and the ending bracket are above the staff.
      expect(system.markLaneY!).toBeGreaterThan(system.staffY + STAFF_HEIGHT);
      const words = placed.markWords!;
      expect(words.lines.join(" ")).toBe(LONG);
      expect(words.x).toBeGreaterThanOrEqual(placed.x);
      expect(words.x + words.width).toBeLessThanOrEqual(placed.x + placed.width);
      for (const line of words.lines) expect(textWidth(line, MARK_FONT_SIZE)).toBeLessThanOrEqual(words.width);
      // The lane is inside the system's slot, so the next system starts below the words.
      const laneBottom = system.markLaneY! + words.lines.length * 14;
      expect(laneBottom).toBeLessThanOrEqual(system.y + system.height);
      const after = systems(layout).find((s) => s.index === system.index + 1);
      if (after && layout.pages.some((p) => p.systems.includes(after) && p.systems.includes(system))) expect(after.y).toBeGreaterThanOrEqual(system.y + system.height);
    });
  }

  it("gives no lane, and the same pages, when the reader has no marks", () => {
    const plain = layoutChart(sourced(), PHONE);
    const empty = layoutChart(sourced(), { ...PHONE, marks: new Map() });
    expect(empty).toEqual(plain);
    expect(systems(plain).every((s) => s.markLaneY === null && s.bars.every((b) => b.markWords === null))).toBe(true);
  });

  it("moves a system that no longer fits under a tall mark lane to the next page", () => {
    const size = { width: 390, height: 600 };
    const plain = layoutChart(sourced(), size);
    const marks = new Map(Array.from({ length: 16 }, (_, i) => [`0:${i}`, { texts: [LONG] }] as const));
    const marked = layoutChart(sourced(), { ...size, marks });
    expect(marked.pages.length).toBeGreaterThan(plain.pages.length);
    for (const page of marked.pages) {
      const last = page.systems[page.systems.length - 1]!;
      expect(last.y + last.height).toBeLessThanOrEqual(page.height);
    }
  });
});
