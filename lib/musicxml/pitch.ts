// Pitch names, key signatures and transposition as MusicXML encodes them: a step letter with an
// alter in semitones, <fifths> for the key (negative = flats), <transpose> as diatonic steps plus
// chromatic semitones that turn a written pitch into the sounding one (MusicXML 4.0).

const LETTERS = ["C", "D", "E", "F", "G", "A", "B"] as const;
export type Step = (typeof LETTERS)[number];
const STEP_PC: Record<Step, number> = { C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 };
/** Position of each letter on the circle of fifths, counted from C. */
const STEP_FIFTHS: Record<Step, number> = { F: -1, C: 0, G: 1, D: 2, A: 3, E: 4, B: 5 };

export interface Transposition {
  diatonic: number;
  chromatic: number;
  octaveChange?: number;
}

export interface Spelled {
  step: Step;
  alter: number;
}

export function isStep(s: string): s is Step {
  return (LETTERS as readonly string[]).includes(s);
}

export function parseName(name: string): Spelled | null {
  const m = /^([A-G])(#{1,2}|b{1,2}|x)?$/.exec(name);
  if (!m) return null;
  const acc = m[2] ?? "";
  const alter = acc === "x" ? 2 : acc.startsWith("#") ? acc.length : -acc.length;
  return { step: m[1] as Step, alter };
}

export function nameOf(p: Spelled): string {
  const a = Math.round(p.alter);
  return p.step + (a > 0 ? "#".repeat(a) : "b".repeat(-a));
}

function mod(n: number, m: number): number {
  return ((n % m) + m) % m;
}

export function pitchClass(p: Spelled): number {
  return mod(STEP_PC[p.step] + p.alter, 12);
}

/** Moves a spelled pitch by `letters` letter names and `semitones`, keeping the letter arithmetic. */
export function shift(p: Spelled, letters: number, semitones: number): Spelled {
  const idx = LETTERS.indexOf(p.step);
  const step = LETTERS[mod(idx + letters, 7)] as Step;
  const target = STEP_PC[p.step] + p.alter + semitones;
  let alter = target - STEP_PC[step];
  // letter arithmetic can cross the octave; keep alter within a tritone
  alter = mod(alter + 6, 12) - 6;
  return { step, alter };
}

/**
 * A double sharp or flat read the way a player would: the plain enharmonic name, keeping the
 * direction of the accidental (Fbb is Eb, E## is F#). `preferFlats` only breaks a remaining tie.
 */
export function simplify(p: Spelled, preferFlats: boolean): Spelled {
  if (Math.abs(p.alter) < 2) return p;
  preferFlats = p.alter < 0 ? true : p.alter > 0 ? false : preferFlats;
  const pc = pitchClass(p);
  for (const step of LETTERS) {
    const alter = mod(pc - STEP_PC[step] + 6, 12) - 6;
    if (alter === 0) return { step, alter };
  }
  for (const step of LETTERS) {
    const alter = mod(pc - STEP_PC[step] + 6, 12) - 6;
    if ((preferFlats && alter === -1) || (!preferFlats && alter === 1)) return { step, alter };
  }
  return p;
}

export interface KeyName {
  tonic: Spelled;
  minor: boolean;
}

export function parseKey(key: string): KeyName | null {
  const m = /^([A-G](?:#|b)?)(m?)$/.exec(key.trim());
  if (!m) return null;
  const tonic = parseName(m[1] as string);
  return tonic ? { tonic, minor: m[2] === "m" } : null;
}

export function formatKey(k: KeyName): string {
  return nameOf(k.tonic) + (k.minor ? "m" : "");
}

/** <fifths> of a key: sharps positive, flats negative (Gardner 1912; MusicXML). */
export function fifthsOfKey(k: KeyName): number {
  return STEP_FIFTHS[k.tonic.step] + 7 * k.tonic.alter - (k.minor ? 3 : 0);
}

export function keyFromFifths(fifths: number, minor: boolean): KeyName {
  const f = fifths + (minor ? 3 : 0);
  // F..B sit at -1..5 on the circle; every 7 steps adds a sharp to the letter
  const alter = Math.floor((f + 1) / 7);
  const pos = f - 7 * alter;
  const step = (Object.keys(STEP_FIFTHS) as Step[]).find((s) => STEP_FIFTHS[s] === pos) as Step;
  return { tonic: { step, alter }, minor };
}

/**
 * The key reached by moving `letters`/`semitones`, respelled to the side with fewer accidentals
 * when it lands beyond six (concert B on a B-flat part is D-flat, not C-sharp: w3c/musicxml #54, #333).
 * On a tie at six, keep the side of the key we came from (common practice).
 */
export function transposeKey(k: KeyName, letters: number, semitones: number): KeyName {
  const moved: KeyName = { tonic: shift(k.tonic, letters, semitones), minor: k.minor };
  let f = fifthsOfKey(moved);
  const fromSharp = fifthsOfKey(k) >= 0;
  while (f > 6 || (f === 6 && !fromSharp)) f -= 12;
  while (f < -6 || (f === -6 && fromSharp)) f += 12;
  return keyFromFifths(f, k.minor);
}

/** Letter distance from one key's tonic up to another's (0..6). */
export function letterDistance(from: Spelled, to: Spelled): number {
  return mod(LETTERS.indexOf(to.step) - LETTERS.indexOf(from.step), 7);
}

/** Semitone distance from one pitch class up to another, in -6..5 (the nearer way). */
export function nearestSemitones(from: Spelled, to: Spelled): number {
  return mod(pitchClass(to) - pitchClass(from) + 6, 12) - 6;
}

/**
 * Moves a chord root from one key to another, spelled the way the target key reads it: the letter
 * moves as the tonic's letter does, and a double accidental falls back to its plain name.
 */
export function moveBetweenKeys(p: Spelled, fromKey: KeyName, toKey: KeyName): Spelled {
  const letters = letterDistance(fromKey.tonic, toKey.tonic);
  const semis = nearestSemitones(fromKey.tonic, toKey.tonic);
  return simplify(shift(p, letters, semis), fifthsOfKey(toKey) < 0);
}

export interface Pitch extends Spelled {
  octave: number;
}

/** Scientific pitch "Eb5" ⇄ MusicXML step/alter/octave. */
export function parseScientific(s: string): Pitch | null {
  const m = /^([A-G])(#{1,2}|b{1,2})?(-?\d)$/.exec(s);
  if (!m) return null;
  const acc = m[2] ?? "";
  return { step: m[1] as Step, alter: acc.startsWith("#") ? acc.length : -acc.length, octave: Number(m[3]) };
}

export function formatScientific(p: Pitch): string {
  return nameOf(p) + String(p.octave);
}

/** Moves a pitch with octave by letters/semitones (semitones may span octaves). */
export function shiftPitch(p: Pitch, letters: number, semitones: number): Pitch {
  const idx = LETTERS.indexOf(p.step) + letters;
  const step = LETTERS[mod(idx, 7)] as Step;
  const octave = p.octave + Math.floor(idx / 7);
  const absolute = p.octave * 12 + STEP_PC[p.step] + p.alter + semitones;
  const alter = absolute - (octave * 12 + STEP_PC[step]);
  return { step, alter, octave };
}

/** simplify() for a pitch with octave: B#3 becomes C4, not C3. */
export function simplifyPitch(p: Pitch, preferFlats: boolean): Pitch {
  if (Math.abs(p.alter) < 2) return p;
  const absolute = p.octave * 12 + STEP_PC[p.step] + p.alter;
  const s = simplify(p, preferFlats);
  return { ...s, octave: Math.round((absolute - STEP_PC[s.step] - s.alter) / 12) };
}
