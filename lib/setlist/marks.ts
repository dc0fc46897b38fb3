// Personal marks: a player's private pencil on one bar of a chart (a short text or a highlight).
// A mark is anchored in concert terms (section + bar), so it lands on the same bar in every key.
// When the leader revises the chart the anchor is found again by section label and the bar's chords;
// when the bar is gone the mark is flagged, never dropped.
import { z } from "zod";
import type { Bar, Chart } from "@/lib/chart/model";
import { IdSchema } from "@/lib/validation/common";

export const MARK_TEXT_MAX = 60;

export const MarkAnchorSchema = z
  .object({
    /** Section index in the chart's `sections` (as `PerformanceBar.source.section`). */
    section: z.number().int().min(0).max(63),
    /** The section's label when the mark was placed ("A", "Bridge"). */
    sectionLabel: z.string().min(1).max(40),
    /** Which section with that label (0 = the first "A"), for forms like A A B A. */
    occurrence: z.number().int().min(0).max(63).default(0),
    /** Bar index inside the section (as `PerformanceBar.source.bar`). */
    bar: z.number().int().min(0).max(511),
    /** The bar's chord symbols when the mark was placed; helps find the bar again after a revision. */
    chords: z.array(z.string().max(40)).max(16).default([]),
  })
  .strict();
export type MarkAnchor = z.infer<typeof MarkAnchorSchema>;

export const MarkKindSchema = z.enum(["text", "highlight"], { message: "A mark is a text or a highlight" });

export const MarkDataSchema = z
  .object({
    anchor: MarkAnchorSchema,
    kind: MarkKindSchema,
    text: z.string().trim().max(MARK_TEXT_MAX, `Keep a mark under ${MARK_TEXT_MAX} characters`).default(""),
    /** The chart revision the anchor was last checked against. */
    chartRevision: z.number().int().min(1),
    /** Set when the bar the mark pointed at is gone from the chart. */
    lost: z.boolean().default(false),
  })
  .strict()
  .refine((m) => m.kind === "highlight" || m.text.length > 0, { message: "A text mark needs some text", path: ["text"] });
export type MarkData = z.infer<typeof MarkDataSchema>;

/** Reads a stored annotation's data; null when it is not a mark this version understands. */
export function readMark(data: unknown): MarkData | null {
  const r = MarkDataSchema.safeParse(data);
  return r.success ? r.data : null;
}

export const MarkInputSchema = z
  .object({
    id: z.uuid().optional(),
    chartId: IdSchema,
    data: MarkDataSchema,
  })
  .strict();
export type MarkInput = z.infer<typeof MarkInputSchema>;

export const MarkUpdateSchema = z.object({ baseRevision: z.number().int().min(1), data: MarkDataSchema }).strict();

function signature(bar: Bar): string {
  return bar.simile ? "%" : bar.chords.map((c) => c.symbol).join(" ");
}

/** The anchor for a bar of this chart. */
export function anchorFor(chart: Chart, section: number, bar: number): MarkAnchor | null {
  const s = chart.sections[section];
  const b = s?.bars[bar];
  if (!s || !b) return null;
  const occurrence = chart.sections.slice(0, section).filter((x) => x.label === s.label).length;
  return { section, sectionLabel: s.label, occurrence, bar, chords: b.simile ? ["%"] : b.chords.map((c) => c.symbol) };
}

export type Placement =
  | { status: "kept" | "moved" | "changed"; section: number; bar: number }
  | { status: "lost" };

const NEARBY = 4;

/**
 * Where the anchor sits in this chart. "kept": same place, same chords; "moved": found the same chords
 * elsewhere (a section or bar was added or removed before it); "changed": the bar is still there but
 * its chords were rewritten; "lost": the section or bar is gone.
 */
export function placeAnchor(chart: Chart, anchor: MarkAnchor): Placement {
  const same = chart.sections
    .map((s, i) => ({ s, i }))
    .filter(({ s }) => s.label === anchor.sectionLabel);
  const found = same[anchor.occurrence] ?? (same.length === 1 ? same[0] : undefined);
  if (!found) return { status: "lost" };
  const bars = found.s.bars;
  const want = anchor.chords.join(" ");
  const at = bars[anchor.bar];
  const sectionMoved = found.i !== anchor.section;
  if (at && (want === "" || signature(at) === want)) {
    return { status: sectionMoved ? "moved" : "kept", section: found.i, bar: anchor.bar };
  }
  if (want !== "") {
    for (let d = 1; d <= NEARBY; d++) {
      for (const j of [anchor.bar - d, anchor.bar + d]) {
        const b = bars[j];
        if (b && signature(b) === want) return { status: "moved", section: found.i, bar: j };
      }
    }
  }
  if (at) return { status: "changed", section: found.i, bar: anchor.bar };
  return { status: "lost" };
}

/** The mark re-checked against a new revision of its chart: anchor moved to where the bar is now, or flagged lost. */
export function reanchorMark(chart: Chart, chartRevision: number, mark: MarkData): { data: MarkData; placement: Placement } {
  const placement = placeAnchor(chart, mark.anchor);
  if (placement.status === "lost") return { data: { ...mark, lost: true, chartRevision }, placement };
  const anchor = anchorFor(chart, placement.section, placement.bar) ?? mark.anchor;
  return { data: { ...mark, anchor, lost: false, chartRevision }, placement };
}

/** What the renderer draws over one bar. */
export interface BarMark {
  highlight: boolean;
  texts: string[];
}

/** Marks keyed by `${section}:${bar}` (the `PerformanceBar.source` of the bar they sit on). Lost marks are left out. */
export function marksByBar(chart: Chart, marks: readonly Pick<MarkData, "anchor" | "kind" | "text">[]): Map<string, BarMark> {
  const out = new Map<string, BarMark>();
  for (const m of marks) {
    const p = placeAnchor(chart, m.anchor);
    if (p.status === "lost") continue;
    const key = `${p.section}:${p.bar}`;
    const slot = out.get(key) ?? { highlight: false, texts: [] };
    if (m.kind === "highlight") slot.highlight = true;
    if (m.text) slot.texts.push(m.text);
    out.set(key, slot);
  }
  return out;
}

export function barKey(source: { section: number; bar: number }): string {
  return `${source.section}:${source.bar}`;
}

/** The bar a player typed for a mark (1-based), or why it cannot be used: never moved to the last bar. */
export function readMarkBar(typed: string, bars: number): { bar: number } | { error: string } {
  const n = Number(typed.trim());
  if (typed.trim() === "" || !Number.isInteger(n)) return { error: `Give a bar number from 1 to ${bars}.` };
  if (n < 1 || n > bars) return { error: `This section has ${bars} ${bars === 1 ? "bar" : "bars"}: give a bar number from 1 to ${bars}.` };
  return { bar: n };
}

/** The words a player typed for a mark, or why they cannot be kept: never cut short without saying so. */
export function readMarkWords(typed: string): { text: string } | { error: string } {
  const text = typed.trim();
  const count = text.length;
  if (count > MARK_TEXT_MAX) return { error: `A mark holds up to ${MARK_TEXT_MAX} characters; this one has ${count}. Shorten it to fit over one bar.` };
  return { text };
}
