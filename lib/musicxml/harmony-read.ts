// Reading one <harmony> element into our Harmony shape.
import type { Degree, Harmony, KindValue } from "./kinds";
import { KIND_VALUES } from "./kinds";
import { isStep, type Spelled } from "./pitch";
import { child, children, numberOf, textOf, type XNode } from "./xml";

function spelled(node: XNode | undefined, stepName: string, alterName: string): Spelled | null {
  const step = textOf(node, stepName)?.trim();
  if (!step || !isStep(step)) return null;
  const alter = Math.round(numberOf(node, alterName) ?? 0);
  return { step, alter: Math.max(-2, Math.min(2, alter)) };
}

/** Null when the element carries no chord we can name (e.g. a function-only harmony). */
export function readHarmony(el: XNode): { harmony: Harmony; unknownKind?: string } | null {
  const kindEl = child(el, "kind");
  const rawKind = (kindEl?.text ?? "").trim();
  const known = (KIND_VALUES as readonly string[]).includes(rawKind);
  const kind: KindValue = known ? (rawKind as KindValue) : "other";
  if (kind === "none") return { harmony: { root: null, kind: "none", degrees: [] } };
  const root = spelled(child(el, "root"), "root-step", "root-alter");
  if (!root) return null;
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
  if (bass) harmony.bass = bass;
  return known ? { harmony } : { harmony, unknownKind: rawKind || "(empty)" };
}
