// Chart text + the form's fields → the chart model, one way for the server and the device.
// The text may leave its header to the fields: the missing header lines are supplied so the parser
// knows the title, key and meter, and an error's line is shifted back to the text as written.
// The fields win over the text's own header lines. Pure.
import { ChartSchema, type Chart } from "./model";
import { ChartTextError } from "./text-error";
import { parseChartText } from "./text-parse";

export interface ChartFields {
  title: string;
  composer: string;
  /** The chart's concert key, "Bb" or "F#m". */
  key: string;
  /** "4/4" */
  meter: string;
  tempo: number | null;
  feel: string;
}

/** "3/4" → { beats: 3, unit: 4 }; an unknown unit reads as quarters. */
export function meterOfText(meter: string): Chart["meter"] {
  const [beats, unit] = meter.split("/").map(Number);
  return { beats: beats ?? 4, unit: (unit === 2 || unit === 8 ? unit : 4) as 2 | 4 | 8 };
}

// `[ \t]*`, not `\s*`: in multiline mode `\s` also eats newlines, so every blank line would rescan
// all the blank lines after it (50,000 of them cost seconds).
const HEADER_LINE = { title: /^[ \t]*title[ \t]*:/im, key: /^[ \t]*key[ \t]*:/im, time: /^[ \t]*time[ \t]*:/im } as const;

/** The header lines the parser needs that the text leaves out, taken from the fields. */
export function missingHeaderLines(fields: Pick<ChartFields, "title" | "key" | "meter">, sourceText: string): string[] {
  const has = (name: keyof typeof HEADER_LINE) => HEADER_LINE[name].test(sourceText);
  const lines: string[] = [];
  if (!has("title")) lines.push(`title: ${fields.title}`);
  if (!has("key")) lines.push(`key: ${fields.key}`);
  if (!has("time")) lines.push(`time: ${fields.meter}`);
  return lines;
}

/**
 * Parses the text with the fields' header lines where it has none and lays the fields over the result.
 * Throws ChartTextError with the line counted in the text as written.
 */
export function joinChartText(fields: ChartFields, sourceText: string): Chart {
  const header = missingHeaderLines(fields, sourceText);
  let parsed: Chart;
  try {
    parsed = parseChartText(sourceText, { header });
  } catch (err) {
    if (err instanceof ChartTextError) throw new ChartTextError(Math.max(1, err.line - header.length), err.column, err.message);
    throw err;
  }
  return ChartSchema.parse({
    ...parsed,
    title: fields.title,
    composer: fields.composer,
    key: fields.key,
    meter: meterOfText(fields.meter),
    tempo: fields.tempo,
    feel: fields.feel,
  });
}
