// The bass line. Swing walks in quarter notes: a chord tone on every downbeat, the root (or the named
// slash bass) on each chord's first beat, and the chord's last note leading into the next root by a
// half step or a step (common practice). A ballad plays in two (half notes); latin and straight feels
// play a simple root–fifth pattern. Register E1–G3, as written for the double bass an octave up. Pure.
import type { Feel, NoteEvent } from "./types";
import { bassChroma, chordToneChromas, nearestOf, timeIn, type GridBar, type Slot } from "./grid";
import { Note } from "tonal";
import type { ChordTones } from "@/lib/music";

export const BASS_LOW = 28; // E1
export const BASS_HIGH = 55; // G3
const HOME = 38; // D2

interface Pulse {
  grid: GridBar;
  beat: number;
  length: number;
  slot: Slot;
  /** First pulse of its slot. */
  first: boolean;
  /** Last pulse of its slot, with another chord after it. */
  last: boolean;
  /** Position of this pulse in its slot, and how many the slot has. */
  idx: number;
  count: number;
}

function pulsesOf(bars: GridBar[], feel: Feel): Pulse[] {
  const out: Pulse[] = [];
  for (const g of bars) {
    const step = feel === "swing" ? 1 : 2;
    for (const slot of g.slots) {
      const beats = slot.wholeBeats.filter((k, i) => i === 0 || k % step === 0);
      beats.forEach((beat, i) => {
        const nextBeat = beats[i + 1] ?? Math.min(g.bar.beats, slot.beat + slot.beats);
        out.push({ grid: g, beat, length: Math.max(1, Math.ceil(nextBeat - beat)), slot, first: i === 0, last: i === beats.length - 1 && beats.length > 1, idx: i, count: beats.length });
      });
    }
  }
  return out;
}

/** A leading note into `target` from the current chord: a chord tone a step away if there is one, else a half step. */
function approach(target: number, from: number, chord: ChordTones): number {
  const tones = chordToneChromas(chord);
  const steps = [-2, 2, -1, 1].map((d) => target + d).filter((n) => n >= BASS_LOW && n <= BASS_HIGH);
  const diatonic = steps.filter((n) => Math.abs(n - target) === 2 && tones.includes(n % 12) && n !== from);
  if (diatonic.length) return diatonic.sort((a, b) => Math.abs(a - from) - Math.abs(b - from))[0]!;
  const below = target - 1;
  const above = target + 1;
  if (above > BASS_HIGH) return below;
  if (below < BASS_LOW) return above;
  // Keep the line going the way it was heading, unless that repeats the note just played.
  const pick = target >= from ? below : above;
  return pick === from ? (pick === below ? above : below) : pick;
}

function walkTone(chord: ChordTones, prev: number, aim: number): number {
  let best = prev;
  let bestCost = Infinity;
  for (const c of chordToneChromas(chord)) {
    for (let n = BASS_LOW; n <= BASS_HIGH; n++) {
      if (n % 12 !== c || n === prev) continue;
      const cost = Math.abs(n - aim) + 0.5 * Math.abs(n - prev);
      if (cost < bestCost) {
        best = n;
        bestCost = cost;
      }
    }
  }
  return best;
}

/** Where the next chord's root will sound, given where the line is now. */
function rootNear(chord: ChordTones, near: number): number {
  const n = nearestOf(bassChroma(chord), near, BASS_LOW, BASS_HIGH);
  // Drift back towards the middle of the bass when the line wanders to an edge.
  return Math.abs(n - HOME) > 12 ? nearestOf(bassChroma(chord), HOME, BASS_LOW, BASS_HIGH) : n;
}

export function bassLine(bars: GridBar[], feel: Feel, after: ChordTones | null, velocity = 0.8): NoteEvent[] {
  const pulses = pulsesOf(bars, feel);
  const out: NoteEvent[] = [];
  let prev = HOME;
  let planned: number | null = null;
  // The next chord's first pulse for each pulse, found once from the end.
  const nextFirst: (Pulse | undefined)[] = new Array(pulses.length);
  for (let i = pulses.length - 1, seen: Pulse | undefined; i >= 0; i--) {
    nextFirst[i] = seen;
    if (pulses[i]!.first) seen = pulses[i];
  }
  for (let i = 0; i < pulses.length; i++) {
    const p = pulses[i]!;
    const chord = p.slot.chord;
    if (!chord) {
      planned = null;
      continue; // N.C.: the bass lays out
    }
    const upcoming = nextFirst[i];
    const nextChord = upcoming ? upcoming.slot.chord : after;
    let note: number;
    if (p.first) note = planned ?? rootNear(chord, prev);
    else if (p.last && nextChord && feel !== "latin" && feel !== "straight") {
      planned = rootNear(nextChord, prev);
      note = approach(planned, prev, chord);
    } else if (feel === "swing") {
      // Head for where the chord ends: chord tones stepping towards the next root, with an arc on a held chord.
      const target = nextChord ? rootNear(nextChord, prev) : prev;
      const root = nearestOf(bassChroma(chord), prev, BASS_LOW, BASS_HIGH);
      const arc = Math.abs(target - root) < 5 ? (root < HOME + 4 ? 7 : -7) : 0;
      const frac = p.idx / p.count;
      note = walkTone(chord, prev, root + (target - root) * frac + arc * Math.sin(Math.PI * frac));
    } else {
      // Two-feel and root–fifth: the fifth (or the nearest other chord tone when there is no 5th).
      const fifthChroma = (Note.chroma(chord.root) + 7) % 12;
      note = chordToneChromas(chord).includes(fifthChroma) ? nearestOf(fifthChroma, prev, BASS_LOW, BASS_HIGH) : walkTone(chord, prev, prev);
    }
    if (p.first) planned = null;
    const beatLen = p.grid.bar.beatSeconds;
    out.push({ kind: "note", part: "bass", time: timeIn(p.grid.bar, p.beat), duration: p.length * beatLen * 0.92, midi: note, velocity: p.beat === 0 ? velocity : velocity * 0.88 });
    prev = note;
  }
  return out;
}
