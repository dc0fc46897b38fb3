// Roman-numeral analysis of a chord in a key. Numerals are counted on the major scale of the tonic
// (so E♭maj7 in C minor is ♭IIImaj7), the case shows the 3rd (upper for major and dominant chords,
// lower for minor, half-diminished and diminished), and the quality follows without its "m":
// Abmaj7 in Eb → IVmaj7, Fm7 → ii7, Dm7b5 in Cm → iiø7, Bdim7 in C → vii°7, G7(b9) in Cm → V7(b9).
import { Interval, Note } from "tonal";
import { formatAlteration, parseChord, qualityOf, type Chord, type ChordTones } from "./chord";
import { keyScale, parseKey, type KeyInfo } from "./keys";

const NUMERALS = ["I", "II", "III", "IV", "V", "VI", "VII"];

function degreeOf(root: string, key: KeyInfo): { degree: number; accidental: string } {
  const ivl = Interval.get(Interval.distance(key.tonic, root));
  const num = ((ivl.num - 1) % 7) + 1;
  const perfect = num === 1 || num === 4 || num === 5;
  const q = ivl.q;
  let alt = 0;
  if (q === "A") alt = 1;
  else if (q === "AA") alt = 2;
  else if (q === "m") alt = -1;
  else if (q === "d") alt = perfect ? -1 : -2;
  else if (q === "dd") alt = perfect ? -2 : -3;
  const accidental = alt > 0 ? "#".repeat(alt) : "b".repeat(-alt);
  return { degree: num, accidental };
}

function suffixFor(chord: ChordTones): string {
  const q = qualityOf(chord);
  let s = chord.quality;
  if (s === "m7b5") s = "ø7";
  else if (s === "dim7") s = "°7";
  else if (s === "dim") s = "°";
  else if (q.family === "minor") s = s.slice(1);
  const alts = chord.alterations.length ? `(${chord.alterations.map(formatAlteration).join(",")})` : "";
  return s + alts;
}

export interface RomanAnalysis {
  /** "IVmaj7", "ii7", "♭VII7" written with ASCII b/#: "bVII7". */
  numeral: string;
  /** 1–7 on the tonic's major scale. */
  degree: number;
  /** "" / "b" / "#" before the numeral. */
  accidental: string;
  /** Upper case (major, dominant, augmented, sus) or lower (minor, diminished). */
  upper: boolean;
}

export function analyseChord(chord: Chord, key: string | KeyInfo): RomanAnalysis | null {
  if (chord.kind === "no-chord") return null;
  const k = typeof key === "string" ? parseKey(key) : key;
  const { degree, accidental } = degreeOf(chord.root, k);
  const fam = qualityOf(chord).family;
  const upper = !(fam === "minor" || fam === "diminished" || fam === "half-diminished");
  const base = NUMERALS[degree - 1]!;
  return { numeral: accidental + (upper ? base : base.toLowerCase()) + suffixFor(chord), degree, accidental, upper };
}

/** romanNumeral("Abmaj7", "Eb") === "IVmaj7". The bass of a slash chord is not shown. N.C. gives "". */
export function romanNumeral(symbol: string, key: string): string {
  return analyseChord(parseChord(symbol), key)?.numeral ?? "";
}

export type HarmonicFunction = "tonic" | "subdominant" | "dominant" | "secondary-dominant" | "chromatic" | "none";

/** The chord's job in the key, as a player would name it. */
export function harmonicFunction(chord: Chord, key: string | KeyInfo): HarmonicFunction {
  const k = typeof key === "string" ? parseKey(key) : key;
  const a = analyseChord(chord, k);
  if (!a || chord.kind === "no-chord") return "none";
  const q = qualityOf(chord);
  const diatonic = keyScale(k).some((pc) => Note.chroma(pc) === Note.chroma(chord.root));
  if (diatonic) {
    if (a.degree === 1) return "tonic"; // a dominant-quality I7 is the tonic of a blues
    if (a.degree === 5 || (a.degree === 7 && a.accidental === "")) return "dominant";
    if (q.dominant && !(k.minor && a.degree === 7)) return "secondary-dominant";
    if (a.degree === 2 || a.degree === 4 || (k.minor && (a.degree === 6 || a.degree === 7))) return "subdominant";
    return "tonic"; // iii and vi (♭III in minor) stand in for the tonic
  }
  if (a.degree === 2 && a.accidental === "b" && q.dominant) return "dominant"; // tritone substitute of V
  if (a.degree === 7 && a.accidental === "" && k.minor) return "dominant"; // leading-tone chord in minor
  if (q.dominant) return "secondary-dominant";
  return "chromatic";
}

/**
 * The numerals a progression is named by in its key, without the chords' sevenths: the minor
 * turnaround Dm7 Bm7♭5 Em7♭5 A7(♭9) in D minor is "i–viø–iiø–V", the major one "I–vi–ii–V".
 */
export function progressionNumerals(symbols: readonly string[], key: string | KeyInfo): string {
  return symbols
    .map((s) => {
      const chord = parseChord(s);
      const a = analyseChord(chord, key);
      if (!a || chord.kind !== "chord") return "N.C.";
      const base = NUMERALS[a.degree - 1]!;
      const fam = qualityOf(chord).family;
      const mark = fam === "half-diminished" ? "ø" : fam === "diminished" ? "°" : "";
      const acc = a.accidental.replace(/b/g, "♭").replace(/#/g, "♯");
      return acc + (a.upper ? base : base.toLowerCase()) + mark;
    })
    .join("–");
}
