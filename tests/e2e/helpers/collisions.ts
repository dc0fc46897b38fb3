// Reads the drawn chart's SVG boxes (getBBox) and names every collision a reader would see: chord
// symbols touching each other or running over their bar's end, an ending number on a chord symbol,
// a section box or ending bracket on the clef of the system above, a title off the page, and mark
// words off their lane (over chord symbols, brackets, labels, directions or any staff) or out of their bar.
// Also returns the smallest clearances measured, for the report.
import type { Locator } from "@playwright/test";

export interface DrawnCheck {
  problems: string[];
  /** Smallest gaps found, in page units: between two chord symbols in a system, from a symbol to its bar's end, from an ending number to a symbol. */
  clearance: { chords: number; barEnd: number; endingNumber: number; markToOther: number };
  counts: { bars: number; chords: number; marks: number; markLines: number };
}

export function checkDrawn(chart: Locator): Promise<DrawnCheck> {
  return chart.evaluate((root) => {
    type Box = { x1: number; y1: number; x2: number; y2: number };
    const problems: string[] = [];
    const clearance = { chords: Infinity, barEnd: Infinity, endingNumber: Infinity, markToOther: Infinity };
    const counts = { bars: 0, chords: 0, marks: 0, markLines: 0 };
    const boxOf = (el: Element): Box => {
      const b = (el as SVGGraphicsElement).getBBox();
      return { x1: b.x, y1: b.y, x2: b.x + b.width, y2: b.y + b.height };
    };
    const rows = (a: Box, b: Box) => a.y1 < b.y2 && b.y1 < a.y2;
    const meet = (a: Box, b: Box, gap: number) => a.x1 < b.x2 + gap && b.x1 < a.x2 + gap && rows(a, b);
    const hGap = (a: Box, b: Box) => Math.max(b.x1 - a.x2, a.x1 - b.x2);
    const at = (b: Box) => `(${b.x1.toFixed(0)},${b.y1.toFixed(0)}–${b.x2.toFixed(0)},${b.y2.toFixed(0)})`;
    for (const svg of root.querySelectorAll<SVGSVGElement>("[data-sheet] > svg")) {
      const page = svg.closest("[data-sheet]")!.getAttribute("data-sheet");
      const view = svg.viewBox.baseVal;
      for (const t of svg.querySelectorAll(".pp-title, .pp-running")) {
        const b = boxOf(t);
        if (b.x1 < 0 || b.x2 > view.width) problems.push(`page ${page}: title runs off the page ${at(b)} of ${view.width}`);
      }
      const bars = [...svg.querySelectorAll(".pp-bar")].map((g) => {
        const stave = g.querySelector(".vf-stave");
        return { g, id: g.getAttribute("data-bar"), stave: stave ? boxOf(stave) : null, chords: [...g.querySelectorAll(".pp-chord")].map(boxOf) };
      });
      counts.bars += bars.length;
      const allChords = bars.flatMap((b) => b.chords);
      counts.chords += allChords.length;
      allChords.forEach((a, i) =>
        allChords.slice(i + 1).forEach((b) => {
          if (!rows(a, b)) return;
          clearance.chords = Math.min(clearance.chords, hGap(a, b));
          if (meet(a, b, 3)) problems.push(`page ${page}: chord symbols touch ${at(a)} ${at(b)}`);
        }),
      );
      for (const bar of bars) {
        const last = bar.chords.reduce<Box | null>((m, c) => (!m || c.x2 > m.x2 ? c : m), null);
        if (bar.stave && last) {
          clearance.barEnd = Math.min(clearance.barEnd, bar.stave.x2 - last.x2);
          if (last.x2 > bar.stave.x2) problems.push(`page ${page} bar ${bar.id}: a chord symbol runs past the bar's end ${at(last)} > ${bar.stave.x2.toFixed(0)}`);
        }
        for (const n of bar.g.querySelectorAll(".pp-ending-number")) {
          const nb = boxOf(n);
          for (const c of bar.chords.filter((c) => rows(nb, c))) clearance.endingNumber = Math.min(clearance.endingNumber, hGap(nb, c));
          if (bar.chords.some((c) => meet(nb, c, 2))) problems.push(`page ${page} bar ${bar.id}: ending number touches a chord symbol`);
        }
      }
      // A section box or ending bracket must keep clear of the clef of the system above. A clef's box is
      // its font's em box (taller than the ink), so only a clef whose middle is above the mark's top counts.
      const clefs = [...svg.querySelectorAll(".vf-clef")].map(boxOf);
      for (const e of svg.querySelectorAll(".pp-label-box, .pp-ending")) {
        const m = boxOf(e);
        for (const c of clefs) if (meet(m, c, 0) && (c.y1 + c.y2) / 2 < m.y1) problems.push(`page ${page}: a ${e.getAttribute("class")} ${at(m)} touches the clef above it ${at(c)}`);
      }
      // Mark words: inside their bar, and clear of everything else drawn.
      const others = [...svg.querySelectorAll(".pp-chord, .pp-ending, .pp-ending-number, .pp-label-box, .pp-direction, .vf-stave")].map((e) => ({ cls: e.getAttribute("class"), b: boxOf(e) }));
      const markTexts = [...svg.querySelectorAll<SVGTextElement>(".pp-mark-text")];
      counts.marks += markTexts.length;
      markTexts.forEach((t, i) => {
        const mb = boxOf(t);
        const bar = bars.find((b) => b.g.contains(t));
        const lines = [...t.querySelectorAll<SVGTSpanElement>(".pp-mark-line")];
        counts.markLines += lines.length;
        if (bar?.stave && (mb.x1 < bar.stave.x1 || mb.x2 > bar.stave.x2)) problems.push(`page ${page} bar ${bar.id}: mark words leave their bar ${at(mb)} of ${at(bar.stave)}`);
        for (const o of others) {
          if (rows(mb, o.b) && mb.x1 < o.b.x2 && o.b.x1 < mb.x2) problems.push(`page ${page} bar ${bar?.id}: mark words ${at(mb)} overlap a ${o.cls} ${at(o.b)}`);
          else if (mb.x1 < o.b.x2 && o.b.x1 < mb.x2) clearance.markToOther = Math.min(clearance.markToOther, Math.max(o.b.y1 - mb.y2, mb.y1 - o.b.y2));
        }
        markTexts.slice(i + 1).forEach((u) => meet(mb, boxOf(u), 2) && problems.push(`page ${page}: two bars' mark words touch`));
      });
    }
    return { problems, clearance, counts };
  });
}
