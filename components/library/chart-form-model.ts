// The chart form's values as typed, and the conversion to the body the server and the outbox take.
import type { LocalChart } from "@/lib/offline/types";
import { ChartInputSchema, type ChartInput } from "@/lib/validation/chart-input";

export interface ChartFormValues {
  title: string;
  composer: string;
  key: string;
  meter: string;
  tempo: string;
  feel: string;
  sourceText: string;
  message: string;
}

export type FieldErrors = Partial<Record<keyof ChartFormValues, string>>;

export interface TextProblem {
  line: number;
  column: number;
  message: string;
}

export const METER_CHOICES = ["4/4", "3/4", "2/4", "2/2", "6/8", "5/4", "7/4", "12/8"];

/** Suggestions only: the feel is free text. */
export const FEEL_SUGGESTIONS = [
  "medium swing",
  "up-tempo swing",
  "ballad",
  "jazz waltz",
  "bossa",
  "samba",
  "afro-cuban",
  "shuffle",
  "funk",
  "straight eighths",
];

export const STARTER_TEXT = `A:
| Cmaj7 | Am7 | Dm7 | G7 |
`;

export function emptyValues(): ChartFormValues {
  return { title: "", composer: "", key: "C", meter: "4/4", tempo: "", feel: "", sourceText: STARTER_TEXT, message: "" };
}

export function valuesFrom(chart: Pick<LocalChart, "title" | "composer" | "key" | "meter" | "tempo" | "feel" | "sourceText">): ChartFormValues {
  return {
    title: chart.title,
    composer: chart.composer,
    key: chart.key,
    meter: chart.meter,
    tempo: chart.tempo === null ? "" : String(chart.tempo),
    feel: chart.feel,
    sourceText: bodyOf(chart.sourceText),
    message: "",
  };
}

// The stored chart text is whole (header lines + sections), like any chart text; the form edits the
// header as fields and the rest in the text box, and joins them again to check and to save.
type HeaderField = "title" | "composer" | "key" | "time" | "tempo" | "feel";
const HEADER_LINE = /^\s*(title|composer|key|time|tempo|feel)\s*:(?!\|)/i;
const FIELD_OF: Record<HeaderField, keyof ChartFormValues> = {
  title: "title",
  composer: "composer",
  key: "key",
  time: "meter",
  tempo: "tempo",
  feel: "feel",
};

/** The text box's part of a stored chart text: everything but the header lines. */
export function bodyOf(sourceText: string): string {
  const lines = sourceText.replace(/\r\n?/g, "\n").split("\n").filter((l) => !HEADER_LINE.test(l));
  while (lines.length && lines[0]!.trim() === "") lines.shift();
  return lines.join("\n");
}

export interface ComposedText {
  text: string;
  /** Which field each header line came from, in order. */
  header: Array<keyof ChartFormValues>;
}

export function composeText(values: ChartFormValues): ComposedText {
  const pairs: Array<[HeaderField, string]> = [
    ["title", values.title.trim()],
    ["composer", values.composer.trim()],
    ["key", values.key.trim()],
    ["time", values.meter.trim()],
    ["tempo", values.tempo.trim()],
    ["feel", values.feel.trim()],
  ];
  const kept = pairs.filter(([, v]) => v !== "");
  const head = kept.map(([name, v]) => `${name}: ${v.replace(/\s#(?=\s|$)/g, " ")}`);
  return { text: `${head.join("\n")}\n\n${values.sourceText}`, header: kept.map(([name]) => FIELD_OF[name]) };
}

/** A message for a person: the parser quotes chart text in backticks, the form in quotation marks. */
export function plainWords(message: string): string {
  return message.replace(/`([^`]*)`/g, "“$1”");
}

/**
 * Where a problem in the joined text sits in the form: a field, or a line of the text box. With the
 * text box empty, the problem is the missing bars, so it sits at the text box (not the last field).
 */
export function placeProblem(composed: ComposedText, p: TextProblem): { field: keyof ChartFormValues; message: string } | TextProblem {
  const headerLines = composed.header.length;
  const message = plainWords(p.message);
  const bodyEmpty = composed.text.split("\n").slice(headerLines).join("").trim() === "";
  if (bodyEmpty && p.line <= headerLines && /bars/i.test(p.message)) return { ...p, message, line: 1, column: 1 };
  if (p.line <= headerLines) return { field: composed.header[p.line - 1] ?? "title", message };
  return { ...p, message, line: Math.max(1, p.line - headerLines - 1) };
}

/** Validates with the same schema the route handler uses, so the form and the server agree. */
export function toInput(values: ChartFormValues): { ok: true; input: ChartInput } | { ok: false; errors: FieldErrors } {
  const tempoText = values.tempo.trim();
  const tempo = tempoText === "" ? null : Number(tempoText);
  const r = ChartInputSchema.safeParse({
    ...values,
    sourceText: composeText(values).text,
    tempo: tempo !== null && Number.isNaN(tempo) ? tempoText : tempo,
  });
  if (r.success) return { ok: true, input: r.data };
  const errors: FieldErrors = {};
  for (const issue of r.error.issues) {
    const field = String(issue.path[0] ?? "") as keyof ChartFormValues;
    if (!(field in values) || errors[field]) continue;
    errors[field] = field === "tempo" ? "Use a whole number of beats per minute between 20 and 400, or leave it empty" : issue.message;
  }
  return { ok: false, errors };
}

/** Field issues from a 422 answer, with the chart-text problem kept apart for its line. */
export function fromServerFields(
  fields: ReadonlyArray<{ field: string; message: string; line?: number; column?: number }>,
  composed?: ComposedText,
): {
  errors: FieldErrors;
  text: TextProblem | null;
} {
  const errors: FieldErrors = {};
  let text: TextProblem | null = null;
  for (const f of fields) {
    const name = f.field.split(".")[0] as keyof ChartFormValues;
    if (name === "sourceText" && f.line) {
      const placed = composed ? placeProblem(composed, { line: f.line, column: f.column ?? 1, message: f.message }) : null;
      if (placed && "field" in placed) errors[placed.field] ??= placed.message;
      else text ??= placed ?? { line: f.line, column: f.column ?? 1, message: f.message };
    }
    else if (name in emptyValues()) errors[name] ??= plainWords(f.message);
  }
  return { errors, text };
}
