// Reading one <harmony> element into our Harmony shape, with notes on what had to change.
import type { Degree, Harmony, KindValue } from "./kinds";
import { KIND_VALUES } from "./kinds";
import { isStep, nameOf, shift, type Spelled } from "./pitch";
import { child, children, numberOf, textOf, type XNode } from "./xml";

function spelled(node: XNode | undefined, stepName: string, alterName: string): Spelled | null {
  const step = textOf(node, stepName)?.trim();
  if (!step || !isStep(step)) return null;
  const alter = Math.round(numberOf(node, alterName) ?? 0);
  return { step, alter: Math.max(-2, Math.min(2, alter)) };
}

const MINOR_THIRD = new Set<KindValue>(["minor", "minor-seventh", "minor-sixth", "minor-ninth", "minor-11th", "minor-13th", "diminished", "diminished-seventh", "half-diminished", "major-minor"]);
const MAJOR_SEVENTH = new Set<KindValue>(["major-seventh", "major-ninth", "major-11th", "major-13th", "major-minor"]);
const TRIADS = new Set<KindValue>(["major", "minor", "augmented", "diminished", "suspended-second", "suspended-fourth", "power", "pedal", "Neapolitan"]);

/** The chord tone an <inversion> puts in the bass: 1 = the 3rd, 2 = the 5th, 3 = the 7th (MusicXML 4.0). */
function inversionBass(root: Spelled, kind: KindValue, inversion: number): Spelled | null {
  const third: [number, number] | null = kind === "power" ? null : kind === "suspended-second" ? [1, 2] : kind === "suspended-fourth" ? [3, 5] : MINOR_THIRD.has(kind) ? [2, 3] : [2, 4];
  const fifth: [number, number] = ["diminished", "diminished-seventh", "half-diminished"].includes(kind) ? [4, 6] : ["augmented", "augmented-seventh"].includes(kind) ? [4, 8] : [4, 7];
  const seventh: [number, number] | null = kind === "major-sixth" || kind === "minor-sixth" ? [5, 9]
    : kind === "diminished-seventh" ? [6, 9] : MAJOR_SEVENTH.has(kind) ? [6, 11] : TRIADS.has(kind) ? null : [6, 10];
  const interval = inversion === 1 ? third : inversion === 2 ? fifth : inversion === 3 ? seventh : null;
  return interval ? shift(root, interval[0], interval[1]) : null;
}

export interface ReadHarmony {
  harmony: Harmony;
  unknownKind?: string;
  /** Report lines about this chord: a respelling, an inversion read as a slash bass. */
  notes: string[];
}

/** Null when the element carries no chord we can name (e.g. a function-only harmony). */
export function readHarmony(el: XNode): ReadHarmony | null {
  const kindEl = child(el, "kind");
  const rawKind = (kindEl?.text ?? "").trim();
  const known = (KIND_VALUES as readonly string[]).includes(rawKind);
  const kind: KindValue = known ? (rawKind as KindValue) : "other";
  if (kind === "none") return { harmony: { root: null, kind: "none", degrees: [] }, notes: [] };
  const root = spelled(child(el, "root"), "root-step", "root-alter");
  if (!root) return null;
  const notes: string[] = [];
  const degrees: Degree[] = [];
  for (const d of children(el, "degree")) {
    const value = numberOf(d, "degree-value");
    const type = textOf(d, "degree-type")?.trim();
    if (value === undefined || (type !== "add" && type !== "alter" && type !== "subtract")) continue;
    degrees.push({ value: Math.round(value), alter: Math.round(numberOf(d, "degree-alter") ?? 0), type });
  }
  const harmony: Harmony = { root, kind, degrees };
  const text = kindEl?.attrs.text;
  if (text) harmony.text = text;
  const bass = spelled(child(el, "bass"), "bass-step", "bass-alter");
  const inversion = numberOf(el, "inversion");
  if (bass) harmony.bass = bass;
  else if (inversion !== undefined && inversion > 0) {
    const b = inversionBass(root, kind, Math.round(inversion));
    if (b) harmony.bass = b;
    else notes.push(`inversions Pedalpoint cannot name (${nameOf(root)} ${rawKind}, inversion ${inversion}), read in root position`);
  }
  for (const [what, p] of [["root", root], ["bass", harmony.bass]] as const) {
    if (p && Math.abs(p.alter) === 2) notes.push(`chord ${what}s with a double ${p.alter < 0 ? "flat" : "sharp"} (${nameOf(p)}), respelled as the plain note`);
  }
  return known ? { harmony, notes } : { harmony, unknownKind: rawKind || "(empty)", notes };
}
