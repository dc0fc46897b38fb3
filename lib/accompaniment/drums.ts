// Drums. Swing: the ride's "ding, ding-a ding-a" (every beat, and the swung "and" of 2 and 4) with the
// hi-hat closing on 2 and 4. A ballad: brushes on every beat, hi-hat on 2 and 4, a soft side-stick on
// the last beat. Latin: straight eighths on the hi-hat, the bossa bass-drum figure and a two-bar
// side-stick figure. Straight eighths: hi-hat eighths, bass drum on 1 and 3, snare on 2 and 4.
// (Common practice.) Pure.
import type { DrumVoice, Feel, HitEvent } from "./types";
import { timeIn, type GridBar } from "./grid";
import { swung } from "./piano";

type Hit = [beat: number, drum: DrumVoice, velocity: number];

/** The back beats: 2 and 4 in four; 2 and 3 in three (a waltz's hi-hat). */
export function backBeats(beats: number): number[] {
  const out: number[] = [];
  for (let k = 1; k < beats; k++) if (beats % 2 === 1 || k % 2 === 1) out.push(k);
  return out;
}

function barHits(feel: Feel, beats: number, barNumber: number): Hit[] {
  const hits: Hit[] = [];
  const back = backBeats(beats);
  if (feel === "swing") {
    for (let k = 0; k < beats; k++) {
      hits.push([k, "ride", k === 0 ? 0.55 : 0.45], [k, "kick", 0.12]); // the bass drum feathered
      if (back.includes(k) && (beats % 2 === 0 || k === 1)) hits.push([k + 0.5, "ride", 0.3]);
    }
    for (const k of back) hits.push([k, "hat", 0.5]);
  } else if (feel === "ballad") {
    for (let k = 0; k < beats; k++) hits.push([k, "brush", k === 0 ? 0.4 : 0.3]);
    for (const k of back) hits.push([k, "hat", 0.3]);
    hits.push([beats - 1, "stick", 0.2]);
  } else if (feel === "latin") {
    for (let e = 0; e < beats * 2; e++) hits.push([e / 2, "hat", e % 2 === 0 ? 0.35 : 0.25]);
    for (const b of [0, 1.5, 2, 3.5]) if (b < beats) hits.push([b, "kick", 0.45]);
    const clave = barNumber % 2 === 1 ? [0, 1.5, 3] : [1, 2.5];
    for (const b of clave) if (b < beats) hits.push([b, "stick", 0.45]);
  } else {
    for (let e = 0; e < beats * 2; e++) hits.push([e / 2, "hat", e % 2 === 0 ? 0.4 : 0.28]);
    for (let k = 0; k < beats; k++) hits.push([k, back.includes(k) ? "snare" : "kick", 0.5]);
  }
  return hits;
}

export function drumPart(bars: GridBar[], feel: Feel, ratio: number): HitEvent[] {
  const out: HitEvent[] = [];
  for (const g of bars) {
    for (const [beat, drum, velocity] of barHits(feel, g.bar.beats, g.bar.number)) {
      const time = timeIn(g.bar, swung(feel, beat, ratio));
      out.push({ kind: "hit", part: "drums", time, duration: drum === "brush" ? g.bar.beatSeconds : 0.1, drum, velocity });
    }
  }
  return out;
}

/** The leader's count: "one … two … one two three four" — half-time clicks, then every beat. */
export function countIn(beats: number, beatSeconds: number): HitEvent[] {
  const out: HitEvent[] = [];
  const halves = beats % 2 === 0 ? [0, beats / 2] : [0];
  for (const k of halves) out.push({ kind: "hit", part: "count", time: k * beatSeconds, duration: 0.05, drum: "stick", velocity: 0.8 });
  for (let k = 0; k < beats; k++) out.push({ kind: "hit", part: "count", time: (beats + k) * beatSeconds, duration: 0.05, drum: "stick", velocity: k === 0 ? 0.8 : 0.65 });
  return out;
}
