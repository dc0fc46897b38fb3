// The beats the rhythm section plays on: each bar's chord slots with the whole beats they cover,
// and a chord's tones as MIDI numbers in a register. Shared by the bass, piano and drums. Pure.
import { Note } from "tonal";
import { chordIntervals, formatChord, parseChord, type ChordTones } from "@/lib/music";
import type { TimedBar } from "./types";

export interface Slot {
  symbol: string;
  chord: ChordTones | null;
  /** Beat the chord starts on in its bar (0-based, may be fractional when three chords share 4/4). */
  beat: number;
  beats: number;
  /** Whole beats that fall inside the slot. */
  wholeBeats: number[];
}

export interface GridBar {
  bar: TimedBar;
  slots: Slot[];
}

export function gridOf(bars: TimedBar[]): GridBar[] {
  return bars.map((bar) => ({
    bar,
    slots: bar.chords.map((c) => {
      const parsed = parseChord(c.symbol);
      const wholeBeats: number[] = [];
      for (let k = Math.ceil(c.beat - 1e-9); k < c.beat + c.beats - 1e-9 && k < bar.beats; k++) wholeBeats.push(k);
      return { symbol: c.symbol, chord: parsed.kind === "chord" ? parsed : null, beat: c.beat, beats: c.beats, wholeBeats };
    }),
  }));
}

/** The note a bass plays for the chord's root: the slash bass when one is named. */
export function bassChroma(chord: ChordTones): number {
  return Note.chroma(chord.bass ?? chord.root);
}

const toneMemo = new Map<string, number[]>();

/** Chord tones (root, 3rd, 5th, 7th/6th — no tensions) as chromas. */
export function chordToneChromas(chord: ChordTones): number[] {
  const key = formatChord(chord);
  let tones = toneMemo.get(key);
  if (!tones) {
    tones = readTones(chord);
    if (toneMemo.size > 2000) toneMemo.clear();
    toneMemo.set(key, tones);
  }
  return tones;
}

function readTones(chord: ChordTones): number[] {
  const root = Note.chroma(chord.root);
  const out = new Set<number>();
  for (const ivl of chordIntervals(chord)) {
    const num = Number(/\d+/.exec(ivl)![0]);
    if (num > 7) continue;
    out.add((root + Note.chroma(Note.transpose("C", ivl))) % 12);
  }
  if (chord.bass) out.add(Note.chroma(chord.bass));
  return [...out];
}

/** The MIDI note of `chroma` nearest to `near`, kept inside [low, high]. */
export function nearestOf(chroma: number, near: number, low: number, high: number): number {
  let best = -1;
  for (let n = low; n <= high; n++) {
    if (n % 12 !== chroma) continue;
    if (best < 0 || Math.abs(n - near) < Math.abs(best - near)) best = n;
  }
  return best;
}

/** Seconds from the first click of a point `beat` beats into a bar. */
export function timeIn(bar: TimedBar, beat: number): number {
  return bar.start + beat * bar.beatSeconds;
}
