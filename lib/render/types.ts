// Shapes of a laid-out chart: pages of systems of bars, every position in page units (CSS px at zoom 1).
// The drawing code reads these and never decides where anything goes.
import type { Meter, PerformanceBar } from "@/lib/chart/model";

export type Clef = "treble" | "bass";

export interface LayoutOptions {
  /** Screen (or sheet) size in CSS px. */
  width: number;
  height: number;
  /** Bars a line when nothing forces fewer; default 4 on a wide screen, fewer on a narrow one. */
  barsPerLine?: number;
  /** CSS px per page unit; default grows with the screen so symbols stay large at arm's length. */
  zoom?: number;
  /** Chord-symbol font size in page units. */
  chordFontSize?: number;
  clef?: Clef;
  /** Sharps or flats in the written key signature (0–7), for the width of a line's opening. */
  keyAccidentals?: number;
  /** Room for the title block on page 1; default true. */
  header?: boolean;
  /** The chart's title block text; lines shown on page 1. */
  title?: string;
  /**
   * Tighter spacing for reading at a desk (the chart page): a slimmer title block and less air
   * between systems, so a laptop screen holds more lines. The bandstand keeps the roomy default.
   */
  compact?: boolean;
  /** The reader's personal marks by bar (`${section}:${bar}` of the bar's source); their words get a lane of their own. */
  marks?: ReadonlyMap<string, { texts: readonly string[] }>;
}

/** A bar's mark words as laid out in its system's mark lane: wrapped lines inside [x, x + width]. */
export interface MarkWords {
  x: number;
  width: number;
  lines: string[];
}

export interface ChordBox {
  symbol: string;
  beat: number;
  beats: number;
  /** Left edge in page units, and the estimated width of the drawn symbol. */
  x: number;
  width: number;
  /** Font size to draw at (smaller only when a crowded bar had to shrink). */
  size: number;
}

export interface PlacedBar {
  bar: PerformanceBar;
  x: number;
  width: number;
  /** Where the beats start (after clef, key and time signature on a line's first bar). */
  noteX: number;
  showClef: boolean;
  showKey: boolean;
  showTime: boolean;
  /** Boxed rehearsal label drawn at this bar ("A", "Bridge"), or null. */
  label: string | null;
  /** Bar belongs to the intro (labelled as such). */
  intro: boolean;
  chords: ChordBox[];
  /** This bar opens / closes an ending bracket (1st, 2nd…) on this line. */
  endingStart: boolean;
  /** Where an ending bracket opening on this bar starts (after a label box, or a line's clef and key). */
  endingX: number;
  endingEnd: boolean;
  /** This reader's mark words under the bar, or null. */
  markWords: MarkWords | null;
}

export interface System {
  index: number;
  /** Top of the system's slot; the staff's top line is at `staffY`. */
  y: number;
  staffY: number;
  /** Top of the rehearsal-label box. */
  labelY: number;
  /** Top of the lane under the staff that holds mark words, or null when no bar of the system has any. */
  markLaneY: number | null;
  height: number;
  bars: PlacedBar[];
}

export interface PageHeader {
  y: number;
  height: number;
  /** Slim title block (one smaller title line and the details under it). */
  compact?: boolean;
}

export interface Page {
  /** 1-based. */
  number: number;
  width: number;
  height: number;
  zoom: number;
  systems: System[];
  header: PageHeader | null;
  /** Systems before this index are what an early turn keeps of the page; `earlyTurnY` is where the next page's systems rise in. */
  earlyTurnIndex: number;
  earlyTurnY: number;
}

export interface ChartLayout {
  pages: Page[];
  meter: Meter;
  clef: Clef;
  chordFontSize: number;
  barsPerLine: number;
}
