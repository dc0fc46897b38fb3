// Chord symbols ⇄ MusicXML <harmony>. The <kind> values and their intervals are MusicXML 4.0's
// (W3C Music Notation CG, "kind-value"). Symbols are written the way a jazz chart prints them:
// no mark on a major triad, alterations in parentheses, C7(b9) (Brandt & Roemer 1976).
// Jazz reading of the stacked kinds: "11" and "13" name the chord; a player leaves out the 3rd in
// C11 and the natural 11th in C13, so dominant-11th reads "C11" and dominant-13th "C13".
import { nameOf, parseName, type Spelled } from "./pitch";

export const KIND_VALUES = [
  "major", "minor", "augmented", "diminished", "dominant", "major-seventh", "minor-seventh",
  "diminished-seventh", "augmented-seventh", "half-diminished", "major-minor", "major-sixth",
  "minor-sixth", "dominant-ninth", "major-ninth", "minor-ninth", "dominant-11th", "major-11th",
  "minor-11th", "dominant-13th", "major-13th", "minor-13th", "suspended-second", "suspended-fourth",
  "Neapolitan", "Italian", "French", "German", "pedal", "power", "Tristan", "other", "none",
] as const;
export type KindValue = (typeof KIND_VALUES)[number];

export interface Degree {
  value: number;
  /** Semitones; for an added degree relative to a dominant chord (MusicXML 4.0). */
  alter: number;
  type: "add" | "alter" | "subtract";
}

export interface Harmony {
  root: Spelled | null; // null for N.C.
  kind: KindValue;
  /** The kind's own display text (MusicXML `kind@text`), used for "alt". */
  text?: string;
  degrees: Degree[];
  bass?: Spelled;
}

/** How each kind reads as a jazz chord-symbol suffix; `approx` marks a classical kind read loosely. */
const KIND_SUFFIX: Record<KindValue, { suffix: string; approx?: string }> = {
  major: { suffix: "" },
  minor: { suffix: "m" },
  augmented: { suffix: "aug" },
  diminished: { suffix: "dim" },
  dominant: { suffix: "7" },
  "major-seventh": { suffix: "maj7" },
  "minor-seventh": { suffix: "m7" },
  "diminished-seventh": { suffix: "dim7" },
  "augmented-seventh": { suffix: "7(#5)" },
  "half-diminished": { suffix: "m7b5" },
  "major-minor": { suffix: "m(maj7)" },
  "major-sixth": { suffix: "6" },
  "minor-sixth": { suffix: "m6" },
  "dominant-ninth": { suffix: "9" },
  "major-ninth": { suffix: "maj9" },
  "minor-ninth": { suffix: "m9" },
  "dominant-11th": { suffix: "11" },
  "major-11th": { suffix: "maj11" },
  "minor-11th": { suffix: "m11" },
  "dominant-13th": { suffix: "13" },
  "major-13th": { suffix: "maj13" },
  "minor-13th": { suffix: "m13" },
  "suspended-second": { suffix: "sus2" },
  "suspended-fourth": { suffix: "sus4" },
  power: { suffix: "5" },
  Neapolitan: { suffix: "", approx: "a Neapolitan sixth, read as a major triad" },
  Italian: { suffix: "7", approx: "an Italian sixth, read as a dominant 7th without 5th" },
  French: { suffix: "7(b5)", approx: "a French sixth, read as 7(b5)" },
  German: { suffix: "7", approx: "a German sixth, read as its enharmonic dominant 7th" },
  Tristan: { suffix: "m7b5", approx: "the Tristan chord, read as its enharmonic m7b5" },
  pedal: { suffix: "", approx: "a pedal point, read as a major triad on the pedal note" },
  other: { suffix: "", approx: "an 'other' chord, read from its text where possible" },
  none: { suffix: "" },
};

export function approximationOf(kind: KindValue): string | undefined {
  return KIND_SUFFIX[kind].approx;
}

function degreeLabel(d: Degree): string {
  const acc = d.alter > 0 ? "#".repeat(d.alter) : d.alter < 0 ? "b".repeat(-d.alter) : "";
  return acc + String(d.value);
}

/** A simpler kind to fall back on when a symbol for `kind` cannot be shown in house style. */
export const KIND_FALLBACK: Partial<Record<KindValue, KindValue>> = {
  "major-11th": "major-ninth",
  "minor-13th": "minor-11th",
  "augmented-seventh": "dominant",
};

/** A <harmony> as a chord symbol, e.g. C7(b9,#11), Bb/D, N.C. */
export function harmonyToSymbol(h: Harmony): string {
  if (h.kind === "none" || !h.root) return "N.C.";
  const root = nameOf(h.root);
  const bass = h.bass ? `/${nameOf(h.bass)}` : "";
  if (h.text && /alt/i.test(h.text) && (h.kind === "dominant" || h.kind === "other")) return `${root}7alt${bass}`;
  let suffix = KIND_SUFFIX[h.kind].suffix;
  if (h.kind === "other" && h.text && /^[\w#()+\-,/]{0,12}$/.test(h.text)) suffix = h.text;
  const rest: Degree[] = [];
  let degrees = [...h.degrees];
  const take = (pred: (d: Degree) => boolean): boolean => {
    const i = degrees.findIndex(pred);
    if (i < 0) return false;
    degrees = degrees.filter((_, j) => j !== i);
    return true;
  };
  // Symbols that name the added tones in the base itself.
  if (h.kind === "suspended-fourth" && take((d) => d.type === "add" && d.value === 7 && d.alter === 0)) {
    suffix = "7sus4";
    if (take((d) => d.type === "add" && d.value === 9 && d.alter === 0)) {
      suffix = take((d) => d.type === "add" && d.value === 13 && d.alter === 0) ? "13sus4" : "9sus4";
    }
  } else if (h.kind === "major-minor" && take((d) => d.type === "add" && d.value === 9 && d.alter === 0)) {
    suffix = "m(maj9)";
  } else if ((h.kind === "major-sixth" || h.kind === "minor-sixth") && take((d) => d.type === "add" && d.value === 9 && d.alter === 0)) {
    suffix = h.kind === "major-sixth" ? "6/9" : "m6/9";
  } else if (h.kind === "minor-seventh" && take((d) => d.type === "alter" && d.value === 5 && d.alter === -1)) {
    suffix = "m7b5";
  } else if (h.kind === "major" || h.kind === "minor") {
    const added = degrees.find((d) => d.type === "add" && d.alter === 0 && (d.value === 9 || d.value === 2 || d.value === 4));
    if (added && take((d) => d === added)) suffix = `${h.kind === "minor" ? "m" : ""}add${added.value}`;
  }
  for (const d of degrees) rest.push(d);
  const parts = rest.map((d) => (d.type === "subtract" ? `no${d.value}` : d.type === "add" && d.alter === 0 && suffix === "" ? `add${d.value}` : degreeLabel(d)));
  if (parts.length === 0) return root + suffix + bass;
  // our own "7(#5)" style suffixes take further alterations inside the same parentheses
  if (/\((?:[#b]\d+,?)+\)$/.test(suffix)) return `${root}${suffix.slice(0, -1)},${parts.join(",")})${bass}`;
  return `${root}${suffix}(${parts.join(",")})${bass}`;
}

interface Base {
  suffix: string;
  kind: KindValue;
  degrees?: Degree[];
  text?: string;
}

const add = (value: number, alter = 0): Degree => ({ value, alter, type: "add" });
const alt = (value: number, alter: number): Degree => ({ value, alter, type: "alter" });

// Longest spellings first so "m7b5" wins over "m7" and "maj9" over "maj".
const BASES: Base[] = [
  { suffix: "m(maj9)", kind: "major-minor", degrees: [add(9)] },
  { suffix: "m(maj7)", kind: "major-minor" },
  { suffix: "mmaj7", kind: "major-minor" },
  { suffix: "m7b5", kind: "half-diminished" },
  { suffix: "m6/9", kind: "minor-sixth", degrees: [add(9)] },
  { suffix: "maj13", kind: "major-13th" },
  { suffix: "maj11", kind: "major-11th" },
  { suffix: "maj9", kind: "major-ninth" },
  { suffix: "maj7", kind: "major-seventh" },
  { suffix: "13sus4", kind: "suspended-fourth", degrees: [add(7), add(9), add(13)] },
  { suffix: "9sus4", kind: "suspended-fourth", degrees: [add(7), add(9)] },
  { suffix: "7sus4", kind: "suspended-fourth", degrees: [add(7)] },
  { suffix: "7sus", kind: "suspended-fourth", degrees: [add(7)] },
  // ours (common practice): root, 3rd, b7 with b9, #9, #11, b13 and no natural 5th
  { suffix: "7alt", kind: "dominant", text: "7alt", degrees: [{ value: 5, alter: 0, type: "subtract" }, add(9, -1), add(9, 1), add(11, 1), add(13, -1)] },
  { suffix: "madd9", kind: "minor", degrees: [add(9)] },
  { suffix: "add9", kind: "major", degrees: [add(9)] },
  { suffix: "add2", kind: "major", degrees: [add(2)] },
  { suffix: "add4", kind: "major", degrees: [add(4)] },
  { suffix: "dim7", kind: "diminished-seventh" },
  { suffix: "sus2", kind: "suspended-second" },
  { suffix: "sus4", kind: "suspended-fourth" },
  { suffix: "sus", kind: "suspended-fourth" },
  { suffix: "aug", kind: "augmented" },
  { suffix: "dim", kind: "diminished" },
  { suffix: "m13", kind: "minor-13th" },
  { suffix: "m11", kind: "minor-11th" },
  { suffix: "m9", kind: "minor-ninth" },
  { suffix: "m7", kind: "minor-seventh" },
  { suffix: "m6", kind: "minor-sixth" },
  { suffix: "6/9", kind: "major-sixth", degrees: [add(9)] },
  { suffix: "13", kind: "dominant-13th" },
  { suffix: "11", kind: "dominant-11th" },
  { suffix: "9", kind: "dominant-ninth" },
  { suffix: "7", kind: "dominant" },
  { suffix: "6", kind: "major-sixth" },
  { suffix: "5", kind: "power" },
  { suffix: "m", kind: "minor" },
  { suffix: "", kind: "major" },
];

/** Spelling variants charts use, brought to the spellings above. */
function normaliseSuffix(s: string): string {
  return s
    .replace(/♭/g, "b")
    .replace(/♯/g, "#")
    .replace(/^(?:Δ|M|ma|Maj)(?=7|9|11|13)/, "maj")
    .replace(/^Δ$/, "maj7")
    .replace(/^(?:-|min|mi)/, "m")
    .replace(/^ø7?/, "m7b5")
    .replace(/^(?:°|o)7/, "dim7")
    .replace(/^(?:°|o)$/, "dim")
    .replace(/^\+/, "aug")
    .replace(/^m\(?M7\)?/, "m(maj7)")
    .replace(/^m7\(b5\)/, "m7b5");
}

/** A chord symbol as a <harmony>, or null when it cannot be read. */
export function symbolToHarmony(symbol: string): Harmony | null {
  const s = symbol.trim();
  if (/^(N\.?C\.?|NC)$/i.test(s)) return { root: null, kind: "none", degrees: [] };
  const m = /^([A-G](?:#|b|♯|♭)?)(.*?)(?:\/([A-G](?:#|b|♯|♭)?))?$/.exec(s);
  if (!m) return null;
  const root = parseName((m[1] as string).replace("♯", "#").replace("♭", "b"));
  if (!root) return null;
  const bassName = m[3]?.replace("♯", "#").replace("♭", "b");
  const bass = bassName ? parseName(bassName) ?? undefined : undefined;
  const suffix = normaliseSuffix(m[2] ?? "");
  const base = BASES.find((b) => suffix.startsWith(b.suffix));
  if (!base) return null;
  const degrees: Degree[] = [...(base.degrees ?? [])];
  let rest = suffix.slice(base.suffix.length).trim();
  if (rest.startsWith("(") && rest.endsWith(")")) rest = rest.slice(1, -1);
  const tokens = rest.split(/[,\s]+/).filter(Boolean).flatMap((t) => t.match(/(?:no|add)?(?:#|b)*\d+/g) ?? [t]);
  for (const t of tokens) {
    const d = /^(no|add)?(#+|b+)?(\d+)$/.exec(t);
    if (!d) return null;
    const value = Number(d[3]);
    const alter = d[2] ? (d[2].startsWith("#") ? d[2].length : -d[2].length) : 0;
    if (d[1] === "no") degrees.push({ value, alter: 0, type: "subtract" });
    else if (value === 5 || (value === 3 && alter !== 0)) degrees.push(alt(value, alter));
    else degrees.push(add(value, alter));
  }
  const h: Harmony = { root, kind: base.kind, degrees };
  if (base.text) h.text = base.text;
  if (bass) h.bass = bass;
  return h;
}
