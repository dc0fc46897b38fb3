import "server-only";
// From what the form sends to what is stored: the chart text parsed into the chart model, with the
// form's metadata fields taking precedence over the text's header lines.
import { ChartTextError, assertChartTextSize, joinChartText } from "@/lib/chart";
import type { Chart } from "@/lib/chart/model";
import type { ChartRow } from "@/db/schema";
import type { ChartInput } from "@/lib/validation/chart-input";
import type { WireChart } from "@/lib/wire";
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

export function prepareChart(input: Pick<ChartInput, "title" | "composer" | "key" | "meter" | "tempo" | "feel" | "sourceText">): PreparedChart {
  // The text may leave its header to the form's fields: joinChartText supplies the missing lines.
  try {
    assertChartTextSize(input.sourceText);
  } catch (err) {
    if (err instanceof ChartTextError) throw new AppError("unprocessable", err.message, { fields: [{ field: "sourceText", message: err.message }] });
    throw err;
  }
  let body: Chart;
  try {
    body = joinChartText(input, input.sourceText);
  } catch (err) {
    if (err instanceof ChartTextError) {
      throw new AppError("unprocessable", err.where, { fields: [{ field: "sourceText", message: err.message, line: err.line, column: err.column }] });
    }
    throw err;
  }
  return {
    title: input.title,
    meta: { composer: input.composer, key: input.key, meter: input.meter, tempo: input.tempo, feel: input.feel },
    body,
    bodyJson: JSON.stringify(body),
    sourceText: input.sourceText,
  };
}

/** A chart in the library list: the wire chart without its text. */
export type ChartSummary = Omit<WireChart, "sourceText" | "body" | "history">;

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

export function toWireChart(row: ChartRow, authorName: string): WireChart {
  return { ...toChartSummary(row, authorName), sourceText: row.source_text, body: JSON.parse(row.body_json) as Chart };
}
