// Progressions built toward a target chord: dominants, ii–V, turnarounds and tritone substitutes.
import { Note } from "tonal";
import { formatChord, parseChord, qualityOf, type Chord, type ChordTones } from "./chord";
import { parseKey } from "./keys";

/** Up-by-interval with the double accidentals a reader never sees folded away (Db + 5d = Abb → G). */
export function transposePc(pc: string, ivl: string): string {
  const n = Note.pitchClass(Note.transpose(pc, ivl));
  return Math.abs(Note.get(n).alt) > 1 ? Note.simplify(n) : n;
}

function asTones(symbol: string | Chord): ChordTones | null {
  const c = typeof symbol === "string" ? parseChord(symbol) : symbol;
  return c.kind === "chord" ? c : null;
}

/** Is this chord minor-family (takes a minor ii–V: iiø–V7(b9))? */
export function isMinorChord(symbol: string | Chord): boolean {
  const c = asTones(symbol);
  if (!c) return false;
  const fam = qualityOf(c).family;
  return fam === "minor" || fam === "half-diminished" || fam === "diminished";
}

export function isDominantChord(symbol: string | Chord): boolean {
  const c = asTones(symbol);
  return c !== null && qualityOf(c).dominant;
}

/** The dominant seventh a perfect fifth above `root`: dominantOf("Eb") === "Bb7". */
export function dominantOf(root: string, quality = "7"): string {
  return `${transposePc(root, "5P")}${quality}`;
}

/** The tritone substitute of a dominant: tritoneSubstitute("G7") === "Db7" (same tritone, root a ♭5 away). */
export function tritoneSubstitute(symbol: string): string {
  const c = asTones(symbol);
  if (!c) return symbol;
  if (!qualityOf(c).dominant) return symbol;
  return formatChord({ kind: "chord", root: transposePc(c.root, "5d"), quality: "7", alterations: [], bass: null });
}

/** ii–V into a chord: major ii7–V7, or iiø7–V7(b9) when the target is minor. */
export function twoFiveInto(target: string, tritoneSub = false): [string, string] {
  const c = asTones(target);
  if (!c) throw new Error(`There is no chord to lead into in "${target}"`);
  const minor = isMinorChord(c);
  const two = `${transposePc(c.root, "2M")}${minor ? "m7b5" : "m7"}`;
  const five = dominantOf(c.root, minor ? "7(b9)" : "7");
  return [two, tritoneSub ? tritoneSubstitute(five) : five];
}

export type TurnaroundVariant = "I-vi-ii-V" | "iii-VI-ii-V";

/**
 * The four chords of a turnaround to the tonic of `key`. Major: I–vi–ii–V (Cmaj7 Am7 Dm7 G7) or
 * iii–VI–ii–V (Em7 A7 Dm7 G7). Minor: i–viø–iiø–V7(b9) or ♭IIImaj7–♭VImaj7–iiø–V7(b9).
 * `blues`: the tonic is a dominant-quality I7 (I7–VI7–ii7–V7). With `tritoneSub`, every dominant but a
 * blues I7 is replaced by its tritone substitute.
 */
export function turnaround(key: string, variant: TurnaroundVariant = "I-vi-ii-V", tritoneSub = false, blues = false): string[] {
  const k = parseKey(key);
  const t = k.tonic;
  let chords: string[];
  if (blues && !k.minor) {
    // A blues tonic is I7, and its turnaround makes the vi a dominant too: I7–VI7–ii7–V7 (common practice).
    chords = variant === "I-vi-ii-V"
      ? [`${t}7`, `${transposePc(t, "6M")}7`, `${transposePc(t, "2M")}m7`, dominantOf(t)]
      : [`${transposePc(t, "3M")}m7`, `${transposePc(t, "6M")}7`, `${transposePc(t, "2M")}m7`, dominantOf(t)];
  } else if (!k.minor) {
    chords = variant === "I-vi-ii-V"
      ? [`${t}maj7`, `${transposePc(t, "6M")}m7`, `${transposePc(t, "2M")}m7`, dominantOf(t)]
      : [`${transposePc(t, "3M")}m7`, `${transposePc(t, "6M")}7`, `${transposePc(t, "2M")}m7`, dominantOf(t)];
  } else {
    chords = variant === "I-vi-ii-V"
      ? [`${t}m7`, `${transposePc(t, "6M")}m7b5`, `${transposePc(t, "2M")}m7b5`, dominantOf(t, "7(b9)")]
      : [`${transposePc(t, "3m")}maj7`, `${transposePc(t, "6m")}maj7`, `${transposePc(t, "2M")}m7b5`, dominantOf(t, "7(b9)")];
  }
  if (!tritoneSub) return chords;
  return chords.map((c, i) => (isDominantChord(c) && !(blues && i === 0 && variant === "I-vi-ii-V") ? tritoneSubstitute(c) : c));
}
