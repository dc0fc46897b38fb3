// Piano voicings for the comping hand. Seventh chords take the rootless four-note voicings in their
// two positions, "A" 3–5–7–9 and "B" 7–9–3–5, with the 13th in place of the 5th on a dominant (Mark
// Levine, The Jazz Piano Book, 1989, the rootless-voicing chapter, from memory); a crowded bar takes
// root–3–7 shells. Each chord picks the position and octave that moves the voices least from the
// chord before, inside the comping range D3–G5. Pure.
import { Interval, Note } from "tonal";
import { chordIntervals, parseChord, qualityOf, type ChordTones } from "@/lib/music";

export const VOICING_LOW = 50; // D3
export const VOICING_HIGH = 79; // G5
/** Where the comping hand sits when nothing came before (around middle C). */
const HOME = 62;

export type Position = "A" | "B" | "shell" | "close";

export interface Voicing {
  position: Position;
  /** MIDI notes, low to high. */
  notes: number[];
  /** Their mean. */
  centre: number;
}

/** The chord's degrees (3, 5, 7…) → semitones above the root, alterations applied. */
function degrees(chord: ChordTones): Map<number, number> {
  const out = new Map<number, number>();
  for (const ivl of chordIntervals(chord)) {
    const i = Interval.get(ivl);
    out.set(i.num, ((i.semitones % 12) + 12) % 12);
  }
  return out;
}

const has = (chord: ChordTones, degree: number, alter: -1 | 1) => chord.alterations.some((a) => a.degree === degree && a.alter === alter);

/** The four slots of a rootless voicing (3rd, 5th, 7th, 9th), as semitones above the root, or null for chords without a 7th or 6th. */
export function rootlessSlots(chord: ChordTones): [number, number, number, number] | null {
  const q = qualityOf(chord);
  const d = degrees(chord);
  const seventh = d.get(7) ?? d.get(6);
  if (seventh === undefined) return null;
  if (q.id === "dim7") return [d.get(3)!, d.get(5)!, seventh, 0]; // symmetric: every tone is a chord tone
  const suspended = q.family === "suspended";
  const third = suspended ? (d.get(4) ?? d.get(11) ?? 5) : d.get(3)!;
  // The 9th: the chord's own (altered or natural); 7alt leans on the ♯9; half-diminished takes the 11th.
  let ninth = d.get(9) ?? 2;
  if (q.id === "7alt") ninth = 3;
  if (q.family === "half-diminished") ninth = d.get(11) ?? 5;
  // The 5th's place: the 13th on a dominant (♭13, or an altered 5th, when named), ♯11 when named.
  let fifth = d.get(5) ?? 7;
  if (q.id === "7alt") fifth = 8;
  else if (has(chord, 13, -1)) fifth = 8;
  else if (has(chord, 5, -1) || has(chord, 5, 1)) fifth = d.get(5)!;
  else if (has(chord, 11, 1)) fifth = 6;
  else if (d.has(13) || (q.dominant && !suspended)) fifth = 9;
  if (q.family === "half-diminished") fifth = d.get(5)!;
  if (q.id === "m11") fifth = 5;
  return [third, fifth, seventh, ninth];
}

/** Chords with no 7th or 6th: their own tones, root left out when three others remain. */
function closeTones(chord: ChordTones): number[] {
  const q = qualityOf(chord);
  const d = degrees(chord);
  // A plain major or minor triad comps as a 6/9 (common practice); the others keep their own tones.
  if (q.id === "") return [4, 7, 9, 2];
  if (q.id === "m") return [3, 7, 9, 2];
  const tones = [...new Set(d.values())];
  return tones.length >= 4 ? tones.filter((t) => t !== 0) : tones;
}

/** Root–3–7 (root–3–5 without a 7th; the 4th for the 3rd on a sus chord). */
export function shellSlots(chord: ChordTones): number[] {
  const q = qualityOf(chord);
  const d = degrees(chord);
  const third = q.family === "suspended" ? (d.get(4) ?? d.get(11) ?? d.get(2) ?? 7) : (d.get(3) ?? 7);
  const top = d.get(7) ?? d.get(6) ?? d.get(5) ?? 7;
  return [0, third, top];
}

/** Stack pitch-class offsets upwards from `first` (each note the next one above). */
function stack(rootChroma: number, slots: number[], first: number): number[] {
  const out = [first];
  for (let i = 1; i < slots.length; i++) {
    const pc = (rootChroma + slots[i]!) % 12;
    let n = out[i - 1]! + 1;
    while (((n % 12) + 12) % 12 !== pc) n++;
    out.push(n);
  }
  return out;
}

/** Every placement of a slot order inside the comping range. */
function placements(rootChroma: number, slots: number[], position: Position): Voicing[] {
  const out: Voicing[] = [];
  const pc = (rootChroma + slots[0]!) % 12;
  for (let first = VOICING_LOW; first <= VOICING_HIGH; first++) {
    if (first % 12 !== pc) continue;
    const notes = stack(rootChroma, slots, first);
    if (notes[notes.length - 1]! <= VOICING_HIGH) out.push({ position, notes, centre: mean(notes) });
  }
  return out;
}

/** How far the voices move from one voicing to the next (semitones in all), plus a pull towards home. */
export function motion(from: number[], to: number[]): number {
  if (from.length === to.length) return to.reduce((s, n, i) => s + Math.abs(n - from[i]!), 0);
  return to.reduce((s, n) => s + Math.min(...from.map((f) => Math.abs(n - f))), 0) + 2 * Math.abs(from.length - to.length);
}

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

const candidateMemo = new Map<string, Voicing[]>();

function candidates(symbol: string, chord: ChordTones, shell: boolean): Voicing[] {
  const key = `${symbol}|${shell}`;
  let list = candidateMemo.get(key);
  if (!list) {
    list = readCandidates(chord, shell);
    if (candidateMemo.size > 2000) candidateMemo.clear();
    candidateMemo.set(key, list);
  }
  return list;
}

function readCandidates(chord: ChordTones, shell: boolean): Voicing[] {
  const root = Note.chroma(chord.root);
  if (shell) return placements(root, shellSlots(chord), "shell");
  const s = rootlessSlots(chord);
  if (!s) return placements(root, closeTones(chord), "close");
  const [third, fifth, seventh, ninth] = s;
  return [...placements(root, [third, fifth, seventh, ninth], "A"), ...placements(root, [seventh, ninth, third, fifth], "B")];
}

/** The voicing for `symbol` that moves least from `previous` (or sits nearest home). Null for N.C. */
export function voiceChord(symbol: string, previous: number[] | null, shell = false): Voicing | null {
  const chord = parseChord(symbol);
  if (chord.kind !== "chord") return null;
  let best: Voicing | null = null;
  let bestCost = Infinity;
  for (const v of candidates(symbol, chord, shell)) {
    const drift = Math.abs(v.centre - HOME);
    const cost = previous && previous.length > 0 ? motion(previous, v.notes) + 0.25 * drift : drift;
    if (cost < bestCost - 1e-9) {
      best = v;
      bestCost = cost;
    }
  }
  return best;
}
