// Raw measures → chart bars: chords on their beats, the melody, repeats, endings, % bars and a pickup,
// each in concert pitch through the mapping in force in that measure.
import type { Bar, ChordSlot, MelodyNote } from "@/lib/chart/model";
import type { Harmony } from "./kinds";
import { formatScientific, type Pitch } from "./pitch";
import type { RawMeasure, RawNote } from "./read-part";
import type { Skipped } from "./report";

const TYPE_CODE: Record<string, MelodyNote["duration"]> = { whole: "w", half: "h", quarter: "q", eighth: "8", "16th": "16" };
const QUARTERS: Record<MelodyNote["duration"], number> = { w: 4, h: 2, q: 1, "8": 0.5, "16": 0.25 };

function durationFromQuarters(q: number): { duration: MelodyNote["duration"]; dots: number } | null {
  for (const [d, base] of Object.entries(QUARTERS) as [MelodyNote["duration"], number][]) {
    for (const dots of [0, 1, 2]) {
      if (Math.abs(base * (2 - 1 / 2 ** dots) - q) < 1e-6) return { duration: d, dots };
    }
  }
  return null;
}

/** Beats snap to 1/48 so thirds and 16ths come back as the same numbers they left as. */
export function round(n: number): number {
  return Math.round(n * 48) / 48;
}

export function chordSlots(m: RawMeasure, barBeats: number, quarterPerBeat: number, toSymbol: (h: Harmony, bar: string) => string | null, skipped: Skipped): ChordSlot[] {
  const hs = m.harmonies.flatMap((h) => {
    const symbol = toSymbol(h.harmony, m.number);
    for (const n of h.notes ?? []) skipped.add(n, m.number);
    return symbol ? [{ pos: h.pos, symbol, guessed: h.guessed }] : [];
  });
  if (hs.length === 0) return [];
  if (hs.some((h) => h.guessed)) skipped.add("chord positions guessed: chords written one after another over one note share it evenly", m.number);
  const distinct = new Set(hs.map((h) => h.pos)).size === hs.length;
  if (!distinct) skipped.add("chord positions guessed: chords at the same beat spread over the bar", m.number);
  const starts = distinct
    ? hs.map((h) => Math.min(round(h.pos / quarterPerBeat), barBeats - 1 / 48))
    : hs.map((_, i) => round((barBeats / hs.length) * i));
  return hs.map((h, i) => {
    const beat = starts[i] ?? 0;
    const next = starts[i + 1] ?? barBeats;
    return { symbol: h.symbol, beat: round(beat), beats: Math.max(1 / 48, round(next - beat)) };
  });
}

export function melodyOf(m: RawMeasure, toConcert: (p: Pitch) => Pitch, skipped: Skipped): MelodyNote[] {
  const out: MelodyNote[] = [];
  for (const n of m.notes as RawNote[]) {
    let dur: { duration: MelodyNote["duration"]; dots: number } | null = null;
    if (n.type && TYPE_CODE[n.type]) dur = { duration: TYPE_CODE[n.type] as MelodyNote["duration"], dots: Math.min(2, n.dots) };
    else if (!n.type) dur = durationFromQuarters(n.quarters);
    if (!dur) {
      skipped.add("melody notes shorter than a 16th or longer than a whole note", m.number);
      continue;
    }
    if (out.length >= 64) {
      skipped.add("melody notes beyond 64 in one bar", m.number);
      continue;
    }
    out.push({ pitch: n.pitch ? formatScientific(toConcert(n.pitch)) : null, duration: dur.duration, dots: dur.dots, tie: n.tie });
  }
  return out;
}

/** The chart's tempo counts beats of the meter's note value; a mark in another unit is converted. */
export function tempoInMeterBeats(quarters: number, unit: number): number {
  return Math.min(400, Math.max(20, Math.round((quarters * unit) / 4)));
}

const UNIT_WORDS: [number, string][] = [[4, "whole note"], [3, "dotted half"], [2, "half"], [1.5, "dotted quarter"], [1, "quarter"], [0.75, "dotted eighth"], [0.5, "eighth"], [0.25, "16th"]];

export function unitWords(quarters: number): string {
  return UNIT_WORDS.find(([q]) => Math.abs(q - quarters) < 1e-6)?.[1] ?? `${quarters}-quarter note`;
}

/** A bar's simile: the file's chords in a `%` bar must be the ones it repeats, else say so. */
export function settleSimile(bar: Bar, repeated: Bar | undefined, number: string, skipped: Skipped): void {
  const same = (a: ChordSlot[], b: ChordSlot[]) => a.length === b.length && a.every((c, i) => c.symbol === b[i]?.symbol && c.beat === b[i]?.beat);
  if (bar.chords.length && repeated && !same(bar.chords, repeated.chords)) {
    skipped.add("chords under a one-bar repeat sign that differ from the bar repeated (the sign wins)", number);
  }
  bar.chords = [];
  // the repeated music written out again is the sign's; a different melody is the bar's own
  const sameMelody = JSON.stringify(bar.melody ?? null) === JSON.stringify(repeated?.melody ?? null);
  if (sameMelody || !repeated) delete bar.melody;
}
