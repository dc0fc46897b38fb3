// Keys, key signatures and enharmonic spelling. A key is written "Eb" (major) or "Cm" (minor).
import { Interval, Key, Note } from "tonal";

export interface KeyInfo {
  /** Pitch class of the tonic, ASCII accidentals ("Eb", "F#"). */
  tonic: string;
  minor: boolean;
  /** The canonical key name: "Eb", "Cm". */
  name: string;
}

/**
 * The keys a picker offers, as they are usually spelt (common practice: the flat side for D♭, E♭, A♭,
 * B♭, both F♯ and G♭ for the six-accidental major key; C♯m, F♯m and G♯m on the sharp side, E♭m and B♭m
 * rather than D♯m and A♯m).
 */
export const MAJOR_KEYS = ["C", "Db", "D", "Eb", "E", "F", "F#", "Gb", "G", "Ab", "A", "Bb", "B"] as const;
export const MINOR_KEYS = ["Cm", "C#m", "Dm", "Ebm", "Em", "Fm", "F#m", "Gm", "G#m", "Am", "Bbm", "Bm"] as const;

const KEY_RE = /^([A-Ga-g])([b#♭♯]?)\s*(m|min|minor|-|maj|major|M)?$/;

/** Reads "Eb", "Cm", "C minor", "F# major", "Bbm". Returns null when it isn't a key name. */
export function readKey(text: string): KeyInfo | null {
  const m = KEY_RE.exec(text.trim());
  if (!m) return null;
  const letter = m[1]!.toUpperCase();
  const acc = (m[2] ?? "").replace("♭", "b").replace("♯", "#");
  const q = m[3] ?? "";
  const minor = q === "m" || q === "min" || q === "minor" || q === "-";
  const tonic = letter + acc;
  return { tonic, minor, name: tonic + (minor ? "m" : "") };
}

export class KeyError extends Error {
  constructor(readonly key: string) {
    super(`"${key}" is not a key: write a major key like Eb or F#, or a minor key like Cm`);
    this.name = "KeyError";
  }
}

export function parseKey(text: string): KeyInfo {
  const k = readKey(text);
  if (!k) throw new KeyError(text);
  return k;
}

const LETTER_FIFTHS: Record<string, number> = { F: -1, C: 0, G: 1, D: 2, A: 3, E: 4, B: 5 };

/**
 * MusicXML <fifths> for a key: negative = flats. May exceed ±7 for theoretical keys (G# major = 8).
 * Counted on the circle of fifths (each sharp on the tonic adds 7); agrees with tonal's Key.alteration.
 */
export function keyFifths(key: KeyInfo): number {
  const n = Note.get(key.tonic);
  return LETTER_FIFTHS[n.letter]! + 7 * n.alt - (key.minor ? 3 : 0);
}

export interface KeySignature {
  /** As MusicXML <fifths>: negative for flats, positive for sharps. */
  fifths: number;
  /** How many sharps or flats the signature has. */
  accidentals: number;
  /** The altered notes in signature order, e.g. ["Bb", "Eb", "Ab"]. */
  notes: string[];
}

const SHARP_ORDER = ["F#", "C#", "G#", "D#", "A#", "E#", "B#"];
const FLAT_ORDER = ["Bb", "Eb", "Ab", "Db", "Gb", "Cb", "Fb"];

export function keySignature(key: string): KeySignature {
  const fifths = keyFifths(parseKey(key));
  const notes = fifths >= 0 ? SHARP_ORDER.slice(0, fifths) : FLAT_ORDER.slice(0, -fifths);
  return { fifths, accidentals: Math.abs(fifths), notes };
}

/** The seven pitch classes of the key's scale (natural minor for minor keys). */
const scaleMemo = new Map<string, string[]>();
export function keyScale(key: KeyInfo): string[] {
  let scale = scaleMemo.get(key.name);
  if (!scale) {
    scale = [...(key.minor ? Key.minorKey(key.tonic).natural.scale : Key.majorKey(key.tonic).scale)];
    scaleMemo.set(key.name, scale);
  }
  return [...scale];
}

function accidentalCount(pc: string): number {
  return Math.abs(Note.get(pc).alt);
}

/** Spellings of a pitch class with at most one accidental, e.g. chroma of C#: ["C#", "Db"]. */
export function spellingsOf(pc: string): string[] {
  const n = Note.get(pc);
  if (n.empty) return [];
  const out = new Set<string>();
  for (const cand of [n.pc, Note.simplify(n.pc), Note.enharmonic(n.pc)]) {
    if (cand && accidentalCount(cand) <= 1) out.add(cand);
  }
  return [...out];
}

/**
 * Respell a key so it has the fewest accidentals (concert B on a B♭ part is D♭, not C♯).
 * On a tie (F♯/G♭, D♯m/E♭m) keep `preferSharps`' side.
 */
export function simplestKey(key: KeyInfo, preferSharps: boolean): KeyInfo {
  const cands = spellingsOf(key.tonic).map((tonic) => ({ tonic, minor: key.minor, name: tonic + (key.minor ? "m" : "") }));
  if (cands.length === 0) return key;
  let best = cands[0]!;
  for (const c of cands.slice(1)) {
    const a = Math.abs(keyFifths(c));
    const b = Math.abs(keyFifths(best));
    if (a < b || (a === b && (keyFifths(c) > 0) === preferSharps)) best = c;
  }
  return best;
}

/**
 * Spell a pitch class the way a player in `key` reads it: the key's own scale note when there is
 * one, otherwise the spelling from the arithmetic unless it needs a double accidental or an odd
 * white-key spelling (E#, B#, Cb, Fb) the key does not use.
 */
export function spellInKey(pc: string, key: KeyInfo): string {
  const n = Note.get(pc);
  if (n.empty) return pc;
  const scale = keyScale(key);
  const diatonic = scale.find((s) => Note.chroma(s) === n.chroma);
  if (diatonic) return diatonic;
  const odd = ["E#", "B#", "Cb", "Fb"];
  if (accidentalCount(n.pc) <= 1 && !odd.includes(n.pc)) return n.pc;
  const flatSide = keyFifths(key) < 0;
  const options = spellingsOf(n.pc).filter((s) => !odd.includes(s));
  const sideMatch = options.find((s) => (flatSide ? s.includes("b") : s.includes("#")));
  return sideMatch ?? options.find((s) => s.length === 1) ?? options[0] ?? Note.simplify(n.pc);
}

/** Move a pitch class by the interval that takes `fromTonic` to `toTonic`, then spell it in `toKey`. */
const moveMemo = new Map<string, string>();

export function movePitchClass(pc: string, fromTonic: string, toKey: KeyInfo): string {
  const memoKey = `${pc} ${fromTonic} ${toKey.name}`;
  let out = moveMemo.get(memoKey);
  if (out === undefined) {
    const ivl = Interval.distance(fromTonic, pc);
    const moved = Note.transpose(toKey.tonic, ivl);
    out = spellInKey(Note.get(moved).pc || moved, toKey);
    if (moveMemo.size > 20000) moveMemo.clear();
    moveMemo.set(memoKey, out);
  }
  return out;
}
