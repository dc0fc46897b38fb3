import { describe, expect, it } from "vitest";
import { layoutChart } from "@/lib/render/layout";
import { estimateSymbolWidth, labelBoxWidth } from "@/lib/render/metrics";
import type { ChartLayout, PlacedBar } from "@/lib/render/types";
import { arrangement, bar } from "./fixtures";

const TABLET = { width: 1024, height: 768 };
const PHONE = { width: 390, height: 844 };

function allBars(layout: ChartLayout): PlacedBar[] {
  return layout.pages.flatMap((p) => p.systems.flatMap((s) => s.bars));
}

function checkNoOverlap(layout: ChartLayout) {
  for (const page of layout.pages) {
    for (const system of page.systems) {
      const boxes = system.bars.flatMap((b) => b.chords);
      for (let i = 1; i < boxes.length; i++) {
        const a = boxes[i - 1]!;
        const b = boxes[i]!;
        expect(a.x + a.width, `${a.symbol} runs into ${b.symbol}`).toBeLessThanOrEqual(b.x);
      }
      const last = system.bars[system.bars.length - 1];
      if (last) expect(last.x + last.width).toBeLessThanOrEqual(page.width + 0.001);
    }
  }
}

describe("layoutChart", () => {
  it("sets four bars a line on a tablet, as chord charts usually are (common practice)", () => {
    const layout = layoutChart(arrangement(16), TABLET);
    const counts = layout.pages[0]!.systems.map((s) => s.bars.length);
    expect(counts).toEqual([4, 4, 4, 4]);
  });

  it("sets fewer bars a line on a narrow phone", () => {
    const layout = layoutChart(arrangement(16), PHONE);
    const counts = layout.pages.flatMap((p) => p.systems.map((s) => s.bars.length));
    expect(Math.max(...counts)).toBeLessThan(4);
    expect(counts.reduce((a, b) => a + b, 0)).toBe(16);
  });

  it("honours an explicit bars-a-line choice", () => {
    // One 8-bar section: 3 + 3 + 2.
    const layout = layoutChart(arrangement(8), { ...TABLET, barsPerLine: 3 });
    expect(layout.pages[0]!.systems.map((s) => s.bars.length)).toEqual([3, 3, 2]);
  });

  it("starts every section and the form after the intro on a new line", () => {
    // 2 intro bars, then sections of 8: A starts at bar 2, B at bar 10.
    const layout = layoutChart(arrangement(18, { intro: 2 }), TABLET);
    const firsts = layout.pages.flatMap((p) => p.systems.map((s) => s.bars[0]!.bar.index));
    expect(firsts).toEqual([0, 2, 6, 10, 14]);
    const labels = allBars(layout).filter((b) => b.label).map((b) => [b.bar.index, b.label]);
    expect(labels).toEqual([[0, "Intro"], [2, "A"], [10, "B"]]);
    expect(allBars(layout).filter((b) => b.intro).map((b) => b.bar.index)).toEqual([0, 1]);
  });

  it("labels a generated intro even when its first bar carries no section name", () => {
    const arr = arrangement(6, { intro: 2 });
    arr.bars[0]!.section = null;
    const first = allBars(layoutChart(arr, TABLET))[0]!;
    expect(first.label).toBe("Intro");
  });

  it("breaks pages so every system fits the screen, and puts the clef and key on every line", () => {
    const layout = layoutChart(arrangement(64), TABLET);
    expect(layout.pages.length).toBeGreaterThan(1);
    for (const page of layout.pages) {
      for (const s of page.systems) {
        expect(s.y + s.height).toBeLessThanOrEqual(page.height);
        expect(s.bars[0]!.showClef && s.bars[0]!.showKey).toBe(true);
      }
    }
    expect(allBars(layout).filter((b) => b.showTime).map((b) => b.bar.index)).toEqual([0]);
    expect(layout.pages.map((p) => p.number)).toEqual(layout.pages.map((_, i) => i + 1));
    expect(layout.pages[0]!.header).not.toBeNull();
    expect(layout.pages[1]!.header).toBeNull();
  });

  it("fills later pages with at least as many systems as the first (which holds the title)", () => {
    const layout = layoutChart(arrangement(128), TABLET);
    const [first, second] = layout.pages;
    expect(second!.systems.length).toBeGreaterThanOrEqual(first!.systems.length);
  });

  it("gives the same layout for the same input", () => {
    const a = layoutChart(arrangement(100, { intro: 4 }), PHONE);
    const b = layoutChart(arrangement(100, { intro: 4 }), PHONE);
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
  });

  it("keeps every bar once, in order, for 1 to 200 bars on phone and tablet", () => {
    for (const size of [PHONE, TABLET]) {
      for (let n = 1; n <= 200; n += n < 20 ? 1 : 17) {
        const layout = layoutChart(arrangement(n), size);
        expect(allBars(layout).map((b) => b.bar.index)).toEqual(Array.from({ length: n }, (_, i) => i));
        checkNoOverlap(layout);
      }
    }
  });

  it("never lets estimated chord-symbol boxes overlap, even in crowded bars", () => {
    const crowded = (i: number) => (i % 3 === 0 ? ["Cmaj7(#11)", "A7(b9#5)", "Dm11", "G13(b9)"] : ["Ebm7b5/Bbb"]);
    for (const size of [PHONE, TABLET]) checkNoOverlap(layoutChart(arrangement(40, { symbols: crowded }), size));
  });

  it("takes fewer bars onto a line when their symbols need the room", () => {
    const busy = (i: number) => (i < 4 ? ["Cmaj7(#11)", "A7(b9#5)", "Dm11(add13)", "G13(b9)"] : ["C"]);
    const layout = layoutChart(arrangement(8, { symbols: busy }), TABLET);
    expect(layout.pages[0]!.systems[0]!.bars.length).toBeLessThan(4);
  });

  it("shrinks the symbols of a bar too crowded for a whole line instead of overlapping them", () => {
    const many = Array.from({ length: 16 }, (_, i) => (i % 2 ? "F7(#11)" : "Bbmaj9"));
    const arr = { ...arrangement(1), bars: [bar(0, many)] };
    const layout = layoutChart(arr, PHONE);
    const placed = allBars(layout)[0]!;
    expect(placed.chords[0]!.width).toBeLessThan(estimateSymbolWidth("Bbmaj9", layout.chordFontSize));
    checkNoOverlap(layout);
  });

  it("draws no symbols over a one-bar repeat sign", () => {
    const arr = arrangement(4);
    arr.bars[1]!.simile = true;
    expect(allBars(layoutChart(arr, TABLET))[1]!.chords).toEqual([]);
  });

  it("marks where ending brackets open and close", () => {
    const arr = arrangement(6);
    arr.bars[2]!.ending = 1;
    arr.bars[3]!.ending = 1;
    arr.bars[4]!.ending = 2;
    const bars = allBars(layoutChart(arr, TABLET));
    expect(bars.map((b) => [b.endingStart, b.endingEnd])).toEqual([
      [false, false], [false, false], [true, false], [false, true], [true, true], [false, false],
    ]);
  });

  it("splits each page at a system boundary for the early turn", () => {
    const page = layoutChart(arrangement(64), TABLET).pages[1]!;
    expect(page.earlyTurnIndex).toBe(Math.ceil(page.systems.length / 2));
    expect(page.earlyTurnY).toBe(page.systems[page.earlyTurnIndex]!.y);
  });

  it("gives an empty chart one empty page", () => {
    const layout = layoutChart({ ...arrangement(1), bars: [] }, TABLET);
    expect(layout.pages).toHaveLength(1);
    expect(layout.pages[0]!.systems).toEqual([]);
  });

  describe("compact spacing for the chart page", () => {
    // The chart box on a 1280×720 laptop, measured in Chromium: 888 × 451 CSS px beside the pickers.
    const LAPTOP_BOX = { width: 888, height: 451, zoom: 1 };

    it("fits at least four systems on the first page, where the roomy layout fits fewer", () => {
      const compact = layoutChart(arrangement(32), { ...LAPTOP_BOX, compact: true });
      const roomy = layoutChart(arrangement(32), LAPTOP_BOX);
      expect(compact.pages[0]!.systems.length).toBeGreaterThanOrEqual(4);
      expect(roomy.pages[0]!.systems.length).toBeLessThan(compact.pages[0]!.systems.length);
      expect(compact.pages[0]!.header).toMatchObject({ compact: true });
      expect(compact.pages[0]!.header!.height).toBeLessThan(roomy.pages[0]!.header!.height);
      expect(roomy.pages[0]!.header!.compact).toBeUndefined();
    });

    it("starts a labelled bar's symbols after its label box, which shares their row", () => {
      const layout = layoutChart(arrangement(18, { intro: 2 }), { ...LAPTOP_BOX, compact: true, keyAccidentals: 0 });
      const labelled = allBars(layout).filter((b) => b.label);
      expect(labelled.length).toBeGreaterThan(0);
      for (const b of labelled) expect(b.chords[0]!.x).toBeGreaterThanOrEqual(b.x + labelBoxWidth(b.label!));
    });

    it("keeps every system inside the page, in order and without overlap, and stays deterministic", () => {
      for (const size of [PHONE, TABLET, LAPTOP_BOX]) {
        const opts = { ...size, compact: true };
        const layout = layoutChart(arrangement(64, { intro: 4 }), opts);
        for (const page of layout.pages) {
          page.systems.forEach((s, i) => {
            expect(s.y + s.height).toBeLessThanOrEqual(page.height);
            const prev = page.systems[i - 1];
            if (prev) expect(s.y).toBeGreaterThanOrEqual(prev.y + prev.height);
          });
        }
        expect(allBars(layout).map((b) => b.bar.index)).toEqual(Array.from({ length: 64 }, (_, i) => i));
        checkNoOverlap(layout);
        expect(JSON.stringify(layoutChart(arrangement(64, { intro: 4 }), opts))).toBe(JSON.stringify(layout));
      }
    });
  });
});
