// Chord symbols: read the spellings charts use, write one house style.
// House style (after Brandt & Roemer): no mark on a major triad, alterations in parentheses,
// comma-separated and ordered by degree — C7(b9,#11); the half-diminished chord is m7b5; dim7 for
// the diminished 7th; + for the augmented triad; ASCII b/# in data, ♭/♯ only in chordDisplayParts.
import { Note } from "tonal";
import { QUALITY_BY_ID, QUALITY_SPELLINGS, type Quality } from "./qualities";

export type AlteredDegree = 5 | 9 | 11 | 13;
export interface Alteration {
  degree: AlteredDegree;
  /** -1 flat, +1 sharp. */
  alter: -1 | 1;
}

export interface ChordTones {
  kind: "chord";
  /** "Bb", "F#": ASCII accidentals. */
  root: string;
  /** House-style quality suffix, a key of QUALITY_BY_ID. */
  quality: string;
  alterations: Alteration[];
  bass: string | null;
}
export interface NoChord {
  kind: "no-chord";
}
export type Chord = ChordTones | NoChord;

export const NO_CHORD = "N.C.";

export class ChordSymbolError extends Error {
  constructor(
    readonly symbol: string,
    readonly reason: string,
  ) {
    super(`Can't read the chord "${symbol}": ${reason}`);
    this.name = "ChordSymbolError";
  }
}

const ALLOWED_ALTERATIONS = new Set(["b5", "#5", "b9", "#9", "#11", "b13"]);
const ALTERATION_TOKEN = /[b#+-](?:13|11|9|5)/g;
const ALTERATIONS_ONLY = /^(?:[b#+-](?:13|11|9|5))*$/;
const NOTE_NAME = /^[A-G][b#]?$/;

/** Spellings that mean a quality plus an altered 5th. */
const COMPOUND: ReadonlyArray<readonly [string, string]> = [
  ["+7", "7"], ["7+", "7"], ["aug7", "7"], ["7aug", "7"],
  ["+maj7", "maj7"], ["maj7+", "maj7"], ["+Δ", "maj7"], ["Δ+", "maj7"], ["augmaj7", "maj7"], ["+M7", "maj7"],
  ["+9", "9"], ["aug9", "9"],
];

function normaliseGlyphs(s: string): string {
  return s.replace(/♭/g, "b").replace(/♯/g, "#").replace(/[−–]/g, "-").replace(/∆/g, "Δ").replace(/\s+/g, "");
}

function readAlterations(text: string, symbol: string): Alteration[] {
  const out: Alteration[] = [];
  for (const m of text.matchAll(ALTERATION_TOKEN)) {
    const raw = m[0];
    const sign = raw[0] === "b" || raw[0] === "-" ? "b" : "#";
    const degree = Number(raw.slice(1)) as AlteredDegree;
    if (!ALLOWED_ALTERATIONS.has(sign + degree)) {
      throw new ChordSymbolError(symbol, `${sign}${degree} is not an alteration we read (use b5, #5, b9, #9, #11 or b13)`);
    }
    out.push({ degree, alter: sign === "b" ? -1 : 1 });
  }
  return out;
}

/** Pull "(b9,#11)"-style groups out of the quality text; leaves groups such as "(maj7)" in place. */
function extractParenAlterations(text: string, symbol: string): { rest: string; alterations: Alteration[] } {
  const alterations: Alteration[] = [];
  const rest = text.replace(/\(([^()]*)\)/g, (whole, inner: string) => {
    const compact = inner.replace(/[,\s/]/g, "");
    if (compact.length > 0 && ALTERATIONS_ONLY.test(compact)) {
      alterations.push(...readAlterations(compact, symbol));
      return "";
    }
    return whole;
  });
  return { rest, alterations };
}

function matchQuality(text: string, symbol: string): { quality: Quality; alterations: Alteration[] } {
  for (const [spelling, base] of COMPOUND) {
    if (text.startsWith(spelling) && ALTERATIONS_ONLY.test(text.slice(spelling.length))) {
      const q = QUALITY_BY_ID.get(base)!;
      return { quality: q, alterations: [{ degree: 5, alter: 1 }, ...readAlterations(text.slice(spelling.length), symbol)] };
    }
  }
  for (const [spelling, quality] of QUALITY_SPELLINGS) {
    if (!text.startsWith(spelling)) continue;
    const tail = text.slice(spelling.length);
    if (ALTERATIONS_ONLY.test(tail)) return { quality, alterations: readAlterations(tail, symbol) };
  }
  if (text.includes("/")) throw new ChordSymbolError(symbol, `the bass note after "/" must be a note A–G, like C/E`);
  throw new ChordSymbolError(symbol, `"${text}" is not a chord quality we know (for example m7, maj7, 7, 7(b9), m7b5, dim7, sus4)`);
}

const byDegree = (a: Alteration, b: Alteration) => a.degree - b.degree || a.alter - b.alter;

/** Fold equivalent spellings into one chord and reject contradictions. */
function canonical(quality: Quality, alts: Alteration[], symbol: string): { quality: Quality; alterations: Alteration[] } {
  const sorted = [...alts].sort(byDegree);
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i]!.degree === sorted[i - 1]!.degree && sorted[i]!.alter === sorted[i - 1]!.alter) {
      throw new ChordSymbolError(symbol, `it names the same alteration twice`);
    }
  }
  const has = (d: number, a: number) => sorted.some((x) => x.degree === d && x.alter === a);
  const without = (d: number, a: number) => sorted.filter((x) => !(x.degree === d && x.alter === a));
  if (quality.id === "m" && has(5, -1) && sorted.length === 1) return { quality: QUALITY_BY_ID.get("dim")!, alterations: [] };
  if (quality.id === "m7" && has(5, -1)) return canonical(QUALITY_BY_ID.get("m7b5")!, without(5, -1), symbol);
  if (quality.id === "" && has(5, 1) && sorted.length === 1) return { quality: QUALITY_BY_ID.get("+")!, alterations: [] };
  if (sorted.length > 0 && quality.id === "7alt") {
    throw new ChordSymbolError(symbol, `7alt already stands for the altered tensions; write 7alt alone or spell them, like 7(b9,#11)`);
  }
  for (const a of sorted) {
    if (a.degree === quality.top) {
      throw new ChordSymbolError(symbol, `a ${quality.top} chord can't also have a ${a.alter < 0 ? "b" : "#"}${a.degree}; write it as 7(${a.alter < 0 ? "b" : "#"}${a.degree})`);
    }
    if (a.degree === 5 && !quality.intervals.includes("5P")) {
      throw new ChordSymbolError(symbol, `this chord has no natural 5th to alter`);
    }
    if (a.degree !== 5 && quality.top < 7 && !quality.intervals.includes("6M")) {
      throw new ChordSymbolError(symbol, `an altered ${a.degree}th needs a 7th chord, like 7(${a.alter < 0 ? "b" : "#"}${a.degree})`);
    }
    if (a.degree === 13 && quality.intervals.includes("13M")) {
      throw new ChordSymbolError(symbol, `it has both a natural 13th and a b13`);
    }
  }
  return { quality, alterations: sorted };
}

// A book repeats the same few hundred symbols: remember what each one read as (bounded).
const memo = new Map<string, Chord>();
const MEMO_LIMIT = 5000;

const copy = (c: Chord): Chord => (c.kind === "chord" ? { ...c, alterations: c.alterations.map((a) => ({ ...a })) } : { kind: "no-chord" });

export function parseChord(symbol: string): Chord {
  const hit = memo.get(symbol);
  if (hit) return copy(hit);
  const chord = readChord(symbol);
  if (memo.size >= MEMO_LIMIT) memo.clear();
  memo.set(symbol, chord);
  return copy(chord);
}

function readChord(symbol: string): Chord {
  const s = normaliseGlyphs(symbol);
  if (s.length === 0) throw new ChordSymbolError(symbol, "it is empty");
  if (/^(N\.?C\.?|n\.c\.)$/i.test(s)) return { kind: "no-chord" };
  const rootMatch = /^([A-G])([b#]?)/.exec(s);
  if (!rootMatch) {
    throw new ChordSymbolError(symbol, /^[a-g]/.test(s) ? "the root is written with a capital letter A–G" : "a chord starts with its root, a note A–G");
  }
  const root = rootMatch[0];
  let rest = s.slice(root.length);
  let bass: string | null = null;
  const slash = rest.lastIndexOf("/");
  if (slash >= 0 && NOTE_NAME.test(rest.slice(slash + 1))) {
    bass = rest.slice(slash + 1);
    rest = rest.slice(0, slash);
  } else if (slash >= 0 && /^[A-Ga-g]/.test(rest.slice(slash + 1))) {
    throw new ChordSymbolError(symbol, `"${rest.slice(slash + 1)}" after "/" is not a bass note; write a note A–G, like C/E or Bb/D`);
  }
  const { rest: qualityText, alterations: parenAlts } = extractParenAlterations(rest, symbol);
  const matched = matchQuality(qualityText, symbol);
  const { quality, alterations } = canonical(matched.quality, [...matched.alterations, ...parenAlts], symbol);
  if (bass !== null && Note.chroma(bass) === Note.chroma(root)) bass = null;
  return { kind: "chord", root, quality: quality.id, alterations, bass };
}

export function formatAlteration(a: Alteration): string {
  return `${a.alter < 0 ? "b" : "#"}${a.degree}`;
}

export function formatChord(chord: Chord): string {
  if (chord.kind === "no-chord") return NO_CHORD;
  const alts = chord.alterations.length ? `(${chord.alterations.map(formatAlteration).join(",")})` : "";
  return `${chord.root}${chord.quality}${alts}${chord.bass ? `/${chord.bass}` : ""}`;
}

/** The symbol in house style, e.g. "Bb-7" → "Bbm7", "C7b9#11" → "C7(b9,#11)". Throws ChordSymbolError. */
export function normaliseChord(symbol: string): string {
  return formatChord(parseChord(symbol));
}

export function qualityOf(chord: ChordTones): Quality {
  return QUALITY_BY_ID.get(chord.quality)!;
}

const ALTERED_INTERVAL: Record<string, string> = { "5:-1": "5d", "5:1": "5A", "9:-1": "9m", "9:1": "9A", "11:1": "11A", "13:-1": "13m" };

/** The chord's intervals above its root (tonal names), alterations applied. */
export function chordIntervals(chord: ChordTones): string[] {
  let ivls = [...qualityOf(chord).intervals];
  for (const a of chord.alterations) {
    if (a.degree === 5) ivls = ivls.filter((i) => i !== "5P");
    if (a.degree === 9) ivls = ivls.filter((i) => i !== "9M");
    ivls.push(ALTERED_INTERVAL[`${a.degree}:${a.alter}`]!);
  }
  const order = (i: string) => Number(/\d+/.exec(i)![0]);
  return ivls.sort((x, y) => order(x) - order(y));
}

/** Pitch classes from the root up, e.g. Cmaj7 → C E G B; a bass that is not a chord tone comes first. */
export function chordPitchClasses(symbol: string | Chord): string[] {
  const chord = typeof symbol === "string" ? parseChord(symbol) : symbol;
  if (chord.kind === "no-chord") return [];
  const pcs = chordIntervals(chord).map((i) => Note.pitchClass(Note.transpose(chord.root, i)));
  if (chord.bass && !pcs.some((p) => Note.chroma(p) === Note.chroma(chord.bass!))) pcs.unshift(chord.bass);
  return pcs;
}

export interface ChordDisplayParts {
  /** The root's letter, "B". */
  root: string;
  /** "♭", "♯" or "". */
  accidental: string;
  /** Set on the baseline after the root: "", "m", "+", "dim" or "°". */
  quality: string;
  /** Set raised and smaller: the 6th/7th/extension and alterations, e.g. "7(♭9)", "maj7", "7♭5", "sus4". */
  superscript: string;
  /** The bass note after the slash with glyphs ("D♭"), or "" when there is none. */
  bass: string;
}

const glyphs = (s: string) => s.replace(/b(?=\d)/g, "♭").replace(/#/g, "♯");

export function chordDisplayParts(symbol: string | Chord): ChordDisplayParts {
  const chord = typeof symbol === "string" ? parseChord(symbol) : symbol;
  if (chord.kind === "no-chord") return { root: NO_CHORD, accidental: "", quality: "", superscript: "", bass: "" };
  const id = chord.quality;
  let quality = "";
  let sup = id;
  if (id === "dim7") [quality, sup] = ["°", "7"];
  else if (id === "dim" || id === "+") [quality, sup] = [id, ""];
  else if (id.startsWith("m") && !id.startsWith("maj")) [quality, sup] = ["m", id.slice(1)];
  const alts = chord.alterations.length ? `(${chord.alterations.map(formatAlteration).join(",")})` : "";
  return {
    root: chord.root[0]!,
    accidental: glyphs(chord.root.slice(1)).replace("b", "♭"),
    quality,
    superscript: glyphs(sup + alts),
    bass: chord.bass ? chord.bass[0]! + chord.bass.slice(1).replace("b", "♭").replace("#", "♯") : "",
  };
}
