// A bar's melody (already at written pitch for the part) as VexFlow notes.
import { StaveNote, StaveTie, Dot } from "./vexflow";
import type { MelodyNote } from "@/lib/chart/model";
import type { Clef } from "@/lib/render/types";

const PITCH = /^([A-Ga-g])([#b♯♭]{0,2})(-?\d)$/;

function vexPitch(pitch: string): string | null {
  const m = PITCH.exec(pitch.trim());
  if (!m) return null;
  const [, letter = "c", acc = "", octave = "4"] = m;
  return `${letter.toLowerCase()}${acc.replace(/♯/g, "#").replace(/♭/g, "b")}/${octave}`;
}

export function melodyNotes(melody: MelodyNote[], clef: Clef): StaveNote[] {
  const restKey = clef === "bass" ? "d/3" : "b/4";
  return melody.map((n) => {
    const key = n.pitch ? vexPitch(n.pitch) : null;
    const note = new StaveNote({
      keys: [key ?? restKey],
      duration: n.duration + (key ? "" : "r"),
      dots: n.dots,
      clef,
      autoStem: true,
    });
    for (let i = 0; i < n.dots; i++) Dot.buildAndAttach([note], { all: true });
    return note;
  });
}

/** Ties inside one bar (a tie into the next bar is left to the player). */
export function melodyTies(melody: MelodyNote[], notes: StaveNote[]): StaveTie[] {
  const ties: StaveTie[] = [];
  melody.forEach((n, i) => {
    const next = notes[i + 1];
    const from = notes[i];
    if (n.tie && from && next && n.pitch) ties.push(new StaveTie({ firstNote: from, lastNote: next, firstIndexes: [0], lastIndexes: [0] }));
  });
  return ties;
}
