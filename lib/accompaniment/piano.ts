// Piano comping: each chord voiced (voicing.ts) and struck in the feel's rhythm. Swing comps the
// Charleston figure (the beat and the swung "and" of the next beat), a ballad holds each chord, latin
// and straight feels push the "and"s. A chord held over several bars keeps its voicing. Pure.
import { formatChord } from "@/lib/music";
import type { Feel, NoteEvent } from "./types";
import { timeIn, type GridBar } from "./grid";
import { swungBeat } from "./feel";
import { voiceChord } from "./voicing";

/** Hits inside a chord slot: [offset in beats from the slot's start, length in beats]. */
function rhythm(feel: Feel, beats: number): [number, number][] {
  if (beats < 2 || feel === "ballad") return [[0, beats]];
  if (feel === "swing") return beats >= 3 ? [[0, 1], [1.5, beats - 1.5]] : [[0, 0.9], [1.5, 0.5]];
  // latin / straight: the beat, then the "and" of the next beat, in each pair of beats.
  const out: [number, number][] = [];
  for (let b = 0; b + 1 < beats; b += 2) out.push([b, 0.75], [b + 1.5, Math.min(1, beats - b - 1.5)]);
  if (beats % 2 === 1) out.push([beats - 1, 1]);
  return out;
}

export function comping(bars: GridBar[], feel: Feel, ratio: number, velocity = 0.55): NoteEvent[] {
  const out: NoteEvent[] = [];
  let previous: number[] | null = null;
  let lastSymbol = "";
  let held: number[] | null = null;
  for (const g of bars) {
    for (const slot of g.slots) {
      if (!slot.chord) {
        lastSymbol = "";
        continue; // N.C.: the piano lays out
      }
      // The piano voices the chord above the bass: a slash bass is the bass player's note.
      const upper = formatChord({ ...slot.chord, bass: null });
      const crowded = slot.beats < 2;
      if (upper !== lastSymbol || crowded || !held) {
        held = voiceChord(upper, previous, crowded)?.notes ?? null;
        lastSymbol = upper;
      }
      if (!held) continue;
      previous = held;
      for (const [offset, length] of rhythm(feel, slot.beats)) {
        const at = slot.beat + offset;
        const start = timeIn(g.bar, swung(feel, at, ratio));
        const end = timeIn(g.bar, Math.min(g.bar.beats, at + length));
        const accent = offset === 0 ? 1 : 0.85;
        for (const midi of held) out.push({ kind: "note", part: "piano", time: start, duration: Math.max(0.05, (end - start) * 0.95), midi, velocity: velocity * accent });
      }
    }
  }
  return out;
}

export function swung(feel: Feel, beat: number, ratio: number): number {
  return feel === "swing" || feel === "ballad" ? swungBeat(beat, ratio) : beat;
}
