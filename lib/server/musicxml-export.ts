import "server-only";
// A chart as a MusicXML download, in concert pitch or written for one of the band's instruments.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { InstrumentId } from "@/lib/music";
import { exportMusicXml, partExportOptions } from "@/lib/musicxml";
import type { Actor } from "./access";
import { getChart } from "./charts";

export async function exportChartMusicXml(
  db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, instrument: InstrumentId,
): Promise<{ filename: string; xml: string }> {
  const chart = await getChart(db, actor, bandId, chartId);
  const xml = exportMusicXml(chart.body, partExportOptions(instrument));
  const base = chart.title.replace(/[^\p{L}\p{N} _-]+/gu, "").trim().replace(/\s+/g, "-") || "chart";
  return { filename: `${base}${instrument === "concert" ? "" : `-${instrument}`}.musicxml`, xml };
}
