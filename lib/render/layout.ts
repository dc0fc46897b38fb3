// Performance bars → systems → pages for one screen or sheet. Pure and deterministic: the same
// arrangement and options give the same pages, so every device in the band reads the same turns.
import type { Arrangement, PerformanceBar } from "@/lib/chart/model";
import { endingLabel, sameEnding } from "@/lib/chart/endings";
import { barKey } from "@/lib/setlist/marks";
import type { ChartLayout, Clef, LayoutOptions, MarkWords, Page, PlacedBar, System } from "./types";
import { minBarWidth, placeChords } from "./bars";
import { keyAccidentalCount } from "./keys";
import { BAR_PAD_END, BAR_PAD_START, MARGIN, STAFF_HEIGHT, endingLabelRoom, labelBoxWidth, openingWidth } from "./metrics";
import { clefFor } from "./part-label";
import { MARK_LANE_DROP, markLaneHeight, wrapMarkWords } from "./marks";

interface Spacing {
  /** The part label in the corner. */
  topStrip: number;
  header: number;
  bottom: number;
  labelRow: number;
  belowStaff: number;
  /** Chord-symbol row height per unit of font size. */
  chordRow: number;
  /** Most spare room added between systems, as a share of a system's slot. */
  spread: number;
  /** Top of the rehearsal-label box below the system's top. */
  labelDrop: number;
}

// The treble clef's tail reaches about 1.6 staff spaces under the staff. Roomy rows leave room for it
// (and a direction or ×N) under each staff; compact rows keep their height and instead set the label
// box level with the chord symbols (`labelDrop`), below the tail. Ending brackets start after a
// line's clef and key, so neither touches the system above.
const ROOMY: Spacing = { topStrip: 24, header: 72, bottom: 10, labelRow: 24, belowStaff: 24, chordRow: 1.35, spread: 0.25, labelDrop: 2 };
const COMPACT: Spacing = { topStrip: 20, header: 46, bottom: 6, labelRow: 18, belowStaff: 8, chordRow: 1.2, spread: 0.1, labelDrop: 11 };

export function defaultZoom(width: number): number {
  return width >= 1000 ? 1.3 : width >= 700 ? 1.15 : 1;
}

export function defaultBarsPerLine(logicalWidth: number): number {
  return logicalWidth >= 640 ? 4 : logicalWidth >= 470 ? 3 : 2;
}

interface Line {
  bars: PerformanceBar[];
  /** Closed because the next bar would not fit (then the line is stretched to the full width). */
  full: boolean;
}

function startsSection(bar: PerformanceBar, prev: PerformanceBar | undefined): boolean {
  return !!prev && (bar.section !== null || bar.part !== prev.part);
}

function breakLines(bars: PerformanceBar[], ctx: LineContext): Line[] {
  const lines: Line[] = [];
  let current: PerformanceBar[] = [];
  let used = 0;
  const widthOf = (bar: PerformanceBar, firstLine: boolean) =>
    Math.max(ctx.nominal(firstLine), minBarWidth(bar, ctx.beats, ctx.fontSize));
  bars.forEach((bar, i) => {
    const firstLine = lines.length === 0;
    const need = widthOf(bar, firstLine) + (current.length === 0 ? ctx.opening(firstLine) : 0);
    const section = startsSection(bar, bars[i - 1]);
    if (current.length > 0 && (section || current.length >= ctx.barsPerLine || used + need > ctx.avail + 0.001)) {
      lines.push({ bars: current, full: !section && current.length < ctx.barsPerLine });
      current = [];
      used = widthOf(bar, false) + ctx.opening(false);
    } else {
      used += need;
    }
    current.push(bar);
  });
  if (current.length) lines.push({ bars: current, full: false });
  return lines;
}

interface LineContext {
  avail: number;
  nominal: (firstLine: boolean) => number;
  barsPerLine: number;
  beats: number;
  fontSize: number;
  opening: (firstLine: boolean) => number;
  firstIntroIndex: number | null;
  /** Compact rows put the chord symbols level with the label box, so symbols start after it. */
  compact: boolean;
  marks: LayoutOptions["marks"];
}

/** The bar's mark words wrapped to the room from its beats' start (past a line's clef and key) to its end. */
function markWordsOf(bar: PerformanceBar, noteX: number, barEnd: number, ctx: LineContext): MarkWords | null {
  const texts = bar.source ? ctx.marks?.get(barKey(bar.source))?.texts : undefined;
  if (!texts || texts.length === 0) return null;
  const x = noteX - BAR_PAD_START + 4;
  const width = Math.max(24, barEnd - 4 - x);
  return { x, width, lines: wrapMarkWords(texts.join(" / "), width) };
}

function placeLine(line: Line, lineIndex: number, ctx: LineContext): PlacedBar[] {
  const opening = ctx.opening(lineIndex === 0);
  const nominal = ctx.nominal(lineIndex === 0);
  const widths = line.bars.map((b) => Math.min(ctx.avail - opening, Math.max(nominal, minBarWidth(b, ctx.beats, ctx.fontSize))));
  const total = widths.reduce((a, w) => a + w, 0) + opening;
  if (line.full && total < ctx.avail) {
    const extra = (ctx.avail - total) / widths.length;
    widths.forEach((w, i) => (widths[i] = w + extra));
  }
  let x = MARGIN;
  return line.bars.map((bar, i) => {
    const first = i === 0;
    const width = (widths[i] ?? nominal) + (first ? opening : 0);
    const noteX = x + (first ? opening : 0) + BAR_PAD_START;
    const label = bar.section ?? (bar.index === ctx.firstIntroIndex ? "Intro" : null);
    const prev = line.bars[i - 1];
    const next = line.bars[i + 1];
    const endingStart = bar.ending !== null && !sameEnding(prev, bar);
    let chordX = ctx.compact && label ? Math.max(noteX, x + labelBoxWidth(label) + 6) : noteX;
    // The ending number sits at the bracket's start (after a label box); the first symbol starts past it.
    if (endingStart && bar.ending !== null) chordX = Math.max(chordX, endingX(x, first ? opening : 0, label) + endingLabelRoom(endingLabel(bar)));
    const chordWidth = Math.max(1, x + width - BAR_PAD_END - chordX);
    const { boxes } = placeChords(bar, ctx.beats, ctx.fontSize, chordX, chordWidth);
    const placed: PlacedBar = {
      bar,
      x,
      width,
      noteX,
      showClef: first,
      showKey: first,
      showTime: first && lineIndex === 0,
      label,
      intro: bar.part === "intro",
      chords: boxes,
      endingStart,
      endingX: endingX(x, first ? opening : 0, label),
      endingEnd: bar.ending !== null && !sameEnding(next, bar),
      markWords: markWordsOf(bar, noteX, x + width, ctx),
    };
    x += width;
    return placed;
  });
}

/** Where a bar's ending bracket starts: after its label box, else after a line's clef and key. */
function endingX(x: number, opening: number, label: string | null): number {
  return label ? x + labelBoxWidth(label) + 8 : x + opening;
}

export function systemHeight(fontSize: number, compact = false): number {
  const sp = compact ? COMPACT : ROOMY;
  return sp.labelRow + Math.round(fontSize * sp.chordRow) + STAFF_HEIGHT + sp.belowStaff;
}

export function layoutChart(arrangement: Arrangement, options: LayoutOptions): ChartLayout {
  const zoom = options.zoom ?? defaultZoom(options.width);
  const width = Math.max(200, options.width / zoom);
  const height = Math.max(200, options.height / zoom);
  const compact = options.compact ?? false;
  const fontSize = options.chordFontSize ?? (width < 480 ? 21 : compact ? 22 : 24);
  const barsPerLine = Math.max(1, Math.floor(options.barsPerLine ?? defaultBarsPerLine(width)));
  const clef: Clef = options.clef ?? clefFor(arrangement.instrument);
  const keyAcc = options.keyAccidentals ?? keyAccidentalCount(arrangement.writtenKey);
  const avail = width - 2 * MARGIN;
  const opening = (firstLine: boolean) => openingWidth(keyAcc, firstLine);
  const ctx: LineContext = {
    avail,
    nominal: (firstLine) => (avail - opening(firstLine)) / barsPerLine,
    barsPerLine,
    beats: arrangement.meter.beats,
    fontSize,
    opening,
    firstIntroIndex: arrangement.bars.find((b) => b.part === "intro")?.index ?? null,
    compact,
    marks: options.marks,
  };
  const lines = breakLines(arrangement.bars, ctx).map((line, i) => placeLine(line, i, ctx));
  const pages = paginate(lines, { width, height, zoom, fontSize, header: options.header ?? true, compact });
  return { pages, meter: arrangement.meter, clef, chordFontSize: fontSize, barsPerLine };
}

interface PageGeometry {
  width: number;
  height: number;
  zoom: number;
  fontSize: number;
  header: boolean;
  compact: boolean;
}

/** Extra height a system needs for its mark lane (below the slot's own room under the staff). */
function markLaneExtra(bars: PlacedBar[], sp: Spacing): number {
  const lines = Math.max(0, ...bars.map((b) => b.markWords?.lines.length ?? 0));
  return lines > 0 ? MARK_LANE_DROP - (STAFF_HEIGHT + sp.belowStaff) + markLaneHeight(lines) : 0;
}

function paginate(lines: PlacedBar[][], g: PageGeometry): Page[] {
  const sp = g.compact ? COMPACT : ROOMY;
  const slot = systemHeight(g.fontSize, g.compact);
  const staffOffset = sp.labelRow + Math.round(g.fontSize * sp.chordRow);
  const pages: Page[] = [];
  let next = 0;
  do {
    const header = g.header && pages.length === 0 ? { y: sp.topStrip, height: sp.header, ...(g.compact ? { compact: true } : {}) } : null;
    const top = sp.topStrip + (header ? sp.header : 0);
    const room = g.height - top - sp.bottom;
    const rows = Math.max(1, Math.floor(room / slot));
    // Spread spare room between systems on every page alike, so turns don't shift the lines. A system
    // with a mark lane is taller; the systems that no longer fit move to the next page.
    const gap = Math.min(Math.max(0, (room - rows * slot) / rows), slot * sp.spread);
    const systems: System[] = [];
    let y = top;
    while (next < lines.length && systems.length < rows) {
      const bars = lines[next] ?? [];
      const extra = markLaneExtra(bars, sp);
      if (systems.length > 0 && y + slot + extra > top + room + 0.001) break;
      const staffY = y + staffOffset;
      systems.push({ index: next, y, staffY, labelY: y + sp.labelDrop, markLaneY: extra > 0 ? staffY + MARK_LANE_DROP : null, height: slot + extra, bars });
      y += slot + extra + gap;
      next++;
    }
    const earlyTurnIndex = Math.ceil(systems.length / 2);
    const earlyTurnY = systems[earlyTurnIndex]?.y ?? g.height;
    pages.push({ number: pages.length + 1, width: g.width, height: g.height, zoom: g.zoom, systems, header, earlyTurnIndex, earlyTurnY });
  } while (next < lines.length);
  return pages;
}
