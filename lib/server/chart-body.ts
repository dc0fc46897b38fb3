import "server-only";
// From what the form sends to what is stored: the chart text parsed into the chart model, with the
// form's metadata fields taking precedence over the text's header lines.
import { ChartTextError, assertChartTextSize, parseChartText } from "@/lib/chart";
import { ChartSchema, type Chart } from "@/lib/chart/model";
import type { ChartRow } from "@/db/schema";
import type { ChartDto, ChartInput } from "@/lib/validation/chart-input";
import { AppError } from "./errors";

export interface ChartMeta {
  composer: string;
  key: string;
  meter: string;
  tempo: number | null;
  feel: string;
}

export interface PreparedChart {
  title: string;
  meta: ChartMeta;
  body: Chart;
  bodyJson: string;
  sourceText: string;
}

function parseMeter(meter: string): Chart["meter"] {
  const [beats, unit] = meter.split("/").map(Number);
  return { beats: beats ?? 4, unit: (unit === 2 || unit === 8 ? unit : 4) as 2 | 4 | 8 };
}

// `[ \t]*`, not `\s*`: in multiline mode `\s` also eats newlines, so every blank line would rescan
// all the blank lines after it (50,000 of them cost seconds).
const HEADER_LINE = { title: /^[ \t]*title[ \t]*:/im, key: /^[ \t]*key[ \t]*:/im, time: /^[ \t]*time[ \t]*:/im } as const;

function missingHeaderLines(input: Pick<ChartInput, "title" | "key" | "meter" | "sourceText">): string[] {
  const has = (name: keyof typeof HEADER_LINE) => HEADER_LINE[name].test(input.sourceText);
  const lines: string[] = [];
  if (!has("title")) lines.push(`title: ${input.title}`);
  if (!has("key")) lines.push(`key: ${input.key}`);
  if (!has("time")) lines.push(`time: ${input.meter}`);
  return lines;
}

export function prepareChart(input: Pick<ChartInput, "title" | "composer" | "key" | "meter" | "tempo" | "feel" | "sourceText">): PreparedChart {
  // The text may leave its header to the form's fields; supply the missing lines so the parser
  // knows the meter, and shift error lines back so they point into the text as written.
  try {
    assertChartTextSize(input.sourceText);
  } catch (err) {
    if (err instanceof ChartTextError) throw new AppError("unprocessable", err.message, { fields: [{ field: "sourceText", message: err.message }] });
    throw err;
  }
  const header = missingHeaderLines(input);
  let parsed: Chart;
  try {
    parsed = parseChartText(input.sourceText, { header });
  } catch (err) {
    if (err instanceof ChartTextError) {
      const line = Math.max(1, err.line - header.length);
      throw new AppError("unprocessable", `Line ${line}, column ${err.column}: ${err.message}`, {
        fields: [{ field: "sourceText", message: err.message, line, column: err.column }],
      });
    }
    throw err;
  }
  const body = ChartSchema.parse({
    ...parsed,
    title: input.title,
    composer: input.composer,
    key: input.key,
    meter: parseMeter(input.meter),
    tempo: input.tempo,
    feel: input.feel,
  });
  return {
    title: input.title,
    meta: { composer: input.composer, key: input.key, meter: input.meter, tempo: input.tempo, feel: input.feel },
    body,
    bodyJson: JSON.stringify(body),
    sourceText: input.sourceText,
  };
}

export type { ChartDto };

export type ChartSummary = Omit<ChartDto, "sourceText" | "body">;

export function toChartSummary(row: ChartRow, authorName: string): ChartSummary {
  return {
    id: row.id,
    bandId: row.band_id,
    title: row.title,
    composer: row.composer,
    key: row.concert_key,
    meter: row.meter,
    tempo: row.tempo,
    feel: row.feel,
    revision: row.revision,
    updatedBy: { id: row.updated_by, name: authorName },
    updatedAt: row.updated_at,
    deletedAt: row.deleted_at,
  };
}

export function toChartDto(row: ChartRow, authorName: string): ChartDto {
  return { ...toChartSummary(row, authorName), sourceText: row.source_text, body: JSON.parse(row.body_json) as Chart };
}
