import "server-only";
// A chart as a MusicXML download, in concert pitch or written for one of the band's instruments; with a
// set-list entry, tonight's arrangement of it (singer's key, chosen intro, tag ending) as the player reads it.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { arrange, type PerformanceOptions } from "@/lib/chart";
import type { InstrumentId } from "@/lib/music";
import { exportArrangement, exportMusicXml, partExportOptions } from "@/lib/musicxml";
import type { Actor } from "./access";
import { getChart } from "./charts";
import { AppError } from "./errors";
import { getSetlist } from "./setlists";

export interface EntryRef {
  setlistId: string;
  entryId: string;
}

async function entryOptions(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, ref: EntryRef): Promise<PerformanceOptions> {
  const setlist = await getSetlist(db, actor, bandId, ref.setlistId);
  const entry = setlist.entries.find((e) => e.id === ref.entryId && e.chartId === chartId);
  if (!entry) throw new AppError("not_found", "That tune is not on this set list.");
  const ending = entry.ending;
  // `tag` is read by lib/chart's arrange (the tag ending's performance bars, drawn the same way on screen)
  const opts = {
    instrument: "concert",
    ...(entry.key ? { key: entry.key } : {}),
    ...(entry.intro ? { intro: entry.intro } : {}),
    tag: ending?.kind === "tag" ? { bars: ending.bars, times: ending.times } : null,
  };
  return opts;
}

export async function exportChartMusicXml(
  db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, instrument: InstrumentId, entry?: EntryRef,
): Promise<{ filename: string; xml: string }> {
  const chart = await getChart(db, actor, bandId, chartId);
  const part = partExportOptions(instrument);
  const xml = entry
    ? exportArrangement(chart.body, arrange(chart.body, await entryOptions(db, actor, bandId, chartId, entry)), part)
    : exportMusicXml(chart.body, part);
  const base = chart.title.replace(/[^\p{L}\p{N} _-]+/gu, "").trim().replace(/\s+/g, "-") || "chart";
  return { filename: `${base}${instrument === "concert" ? "" : `-${instrument}`}.musicxml`, xml };
}
