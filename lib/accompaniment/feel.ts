// The feel a chart's words ask for, and how far swung eighths lean at a tempo.
import type { Feel } from "./types";

const LATIN = /bossa|samba|latin|mambo|cha|rhumba|rumba|bolero|calypso|afro|songo|salsa|montuno/i;
const STRAIGHT = /straight|even|rock|funk|pop|fusion|ecm|groove|grind/i;
const BALLAD = /ballad/i;

/** "medium swing", "jazz waltz", "up swing" → swing; "bossa" → latin; "ballad" → ballad; "straight eighths" → straight. */
export function feelOf(text: string): Feel {
  if (text === "swing" || text === "ballad" || text === "latin" || text === "straight") return text;
  if (BALLAD.test(text)) return "ballad";
  if (LATIN.test(text)) return "latin";
  if (STRAIGHT.test(text)) return "straight";
  return "swing";
}

// The long–short ratio of swung eighths falls as the tempo rises (A. Friberg & A. Sundström, "Swing
// ratios and ensemble timing in jazz performance", Music Perception 19(3), 2002 — recalled from
// memory): wide, about 3:1, at slow tempos; about 2:1 at medium tempos; nearly even at the fastest.
// Our curve: 3:1 up to 80 beats a minute, 2:1 at 160, 1:1 at 320, straight lines between.
const SLOW = { bpm: 80, ratio: 3 };
const MEDIUM = { bpm: 160, ratio: 2 };
const FAST = { bpm: 320, ratio: 1 };

export function swingRatio(bpm: number): number {
  if (bpm <= SLOW.bpm) return SLOW.ratio;
  if (bpm <= MEDIUM.bpm) return SLOW.ratio + ((bpm - SLOW.bpm) * (MEDIUM.ratio - SLOW.ratio)) / (MEDIUM.bpm - SLOW.bpm);
  if (bpm <= FAST.bpm) return MEDIUM.ratio + ((bpm - MEDIUM.bpm) * (FAST.ratio - MEDIUM.ratio)) / (FAST.bpm - MEDIUM.bpm);
  return FAST.ratio;
}

/**
 * Where a point `beat` beats into a bar falls, in beats, once swung: the off-beat eighth (x.5) moves
 * to ratio/(1+ratio) of its beat; other points stay.
 */
export function swungBeat(beat: number, ratio: number): number {
  const whole = Math.floor(beat);
  const frac = beat - whole;
  if (Math.abs(frac - 0.5) > 1e-9 || ratio === 1) return beat;
  return whole + ratio / (1 + ratio);
}
