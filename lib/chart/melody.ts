// Melody notes in chart text: `Eb5:q`, `G4:h.`, `r:8` (a rest), `C5:w~` (tied into the next note).
// A note without `:duration` is a quarter. Pitches are concert, scientific octave numbers (C4 = middle C).
import type { Meter, MelodyNote } from "./model";

export const DURATION_QUARTERS: Record<MelodyNote["duration"], number> = { w: 4, h: 2, q: 1, "8": 0.5, "16": 0.25 };

const NOTE_RE = /^(r|[A-G](?:b|#|♭|♯)?[0-8])(?::(w|h|q|8|16)(\.{0,2}))?(~?)$/;

export function readMelodyNote(token: string): MelodyNote | null {
  const m = NOTE_RE.exec(token);
  if (!m) return null;
  const pitch = m[1] === "r" ? null : m[1]!.replace("♭", "b").replace("♯", "#");
  return {
    pitch,
    duration: (m[2] ?? "q") as MelodyNote["duration"],
    dots: (m[3] ?? "").length,
    tie: m[4] === "~" && pitch !== null,
  };
}

export function formatMelodyNote(n: MelodyNote): string {
  return `${n.pitch ?? "r"}:${n.duration}${".".repeat(n.dots)}${n.tie && n.pitch ? "~" : ""}`;
}

/** Length of a note in quarter notes, dots included. */
export function noteQuarters(n: MelodyNote): number {
  const base = DURATION_QUARTERS[n.duration];
  return n.dots === 2 ? base * 1.75 : n.dots === 1 ? base * 1.5 : base;
}

/** Length of a bar in quarter notes: 4/4 → 4, 6/8 → 3, 2/2 → 4. */
export function barQuarters(meter: Meter): number {
  return (meter.beats * 4) / meter.unit;
}

/** Beats (in the meter's own unit) as words: "3 beats", "1 beat", "2½ beats". */
export function beatWords(beats: number): string {
  const whole = Math.floor(beats);
  const frac = beats - whole;
  const fracText = frac === 0 ? "" : frac === 0.5 ? "½" : frac === 0.25 ? "¼" : frac === 0.75 ? "¾" : `.${String(frac).slice(2)}`;
  const text = `${whole === 0 && fracText ? "" : whole}${fracText}`;
  return `${text} beat${beats === 1 ? "" : "s"}`;
}
