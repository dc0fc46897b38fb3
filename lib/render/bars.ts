// One bar's horizontal needs and its chord-symbol boxes. The boxes are placed left to right, each at
// its beat or just after the previous symbol, so two symbols never share space.
import type { PerformanceBar } from "@/lib/chart/model";
import type { ChordBox } from "./types";
import { BAR_PAD_END, BAR_PAD_START, CHORD_END_SLACK, CHORD_GAP, MIN_BEAT_SPACE, estimateSymbolWidth } from "./metrics";

const SIMILE_WIDTH = 56;

function shownChords(bar: PerformanceBar) {
  return bar.simile ? [] : [...bar.chords].sort((a, b) => a.beat - b.beat);
}

/** Narrowest beat area (between the paddings) that fits the bar's symbols at this font size. */
export function minNoteWidth(bar: PerformanceBar, beats: number, fontSize: number): number {
  if (bar.simile) return SIMILE_WIDTH;
  const chords = shownChords(bar);
  const widths = chords.map((c) => estimateSymbolWidth(c.symbol, fontSize));
  let need = beats * MIN_BEAT_SPACE;
  let tail = -CHORD_END_SLACK;
  for (let i = chords.length - 1; i >= 0; i--) {
    tail += (widths[i] ?? 0) + (i < chords.length - 1 ? CHORD_GAP : 0);
    const f = Math.min(Math.max((chords[i]?.beat ?? 0) / beats, 0), 0.95);
    need = Math.max(need, tail / (1 - f));
  }
  return Math.ceil(need);
}

export function minBarWidth(bar: PerformanceBar, beats: number, fontSize: number): number {
  return minNoteWidth(bar, beats, fontSize) + BAR_PAD_START + BAR_PAD_END;
}

/**
 * Boxes for the bar's symbols inside [noteX, noteX + noteWidth]. When even the narrowest placement
 * overflows (a bar crowded beyond one line), the symbols shrink by `scale` until they fit.
 */
export function placeChords(
  bar: PerformanceBar,
  beats: number,
  fontSize: number,
  noteX: number,
  noteWidth: number,
): { boxes: ChordBox[]; scale: number } {
  const chords = shownChords(bar);
  let scale = 1;
  for (;;) {
    const boxes: ChordBox[] = [];
    let cursor = noteX;
    for (const c of chords) {
      const width = estimateSymbolWidth(c.symbol, fontSize * scale);
      const f = Math.min(Math.max(c.beat / beats, 0), 0.95);
      const x = Math.max(noteX + f * noteWidth, cursor);
      boxes.push({ symbol: c.symbol, beat: c.beat, beats: c.beats, x, width, size: Math.round(fontSize * scale * 10) / 10 });
      cursor = x + width + CHORD_GAP;
    }
    const last = boxes[boxes.length - 1];
    const fits = !last || last.x + last.width <= noteX + noteWidth + CHORD_END_SLACK;
    if (fits || scale <= 0.3) return { boxes, scale };
    scale = Math.round(scale * 90) / 100;
  }
}
