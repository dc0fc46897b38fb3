import "server-only";
// A chart's history: every published revision with its author, and putting an older one back
// (as a new revision, so history only grows).
import type { Kysely } from "kysely";
import type { ChartRow, Database } from "@/db/schema";
import { ChartTextError } from "@/lib/chart";
import { requireChartReader } from "./chart-access";
import { requireMember, type Actor, signedIn } from "./access";
import { prepareChart, toWireChart, type ChartMeta, type PreparedChart } from "./chart-body";
import { loadChartRow, writeRevision } from "./chart-store";
import { assertPlanAllows } from "./billing";
import { AppError } from "./errors";
import { nowIso } from "./tokens";
import type { WireChart } from "@/lib/wire";

export interface RevisionDto {
  revision: number;
  title: string;
  message: string;
  author: { id: string; name: string };
  createdAt: string;
  meta: ChartMeta;
  sourceText: string;
}

export async function listRevisions(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string): Promise<RevisionDto[]> {
  await requireChartReader(db, actor, bandId, chartId);
  const chart = await loadChartRow(db, bandId, chartId);
  if (!chart) throw new AppError("not_found", "That chart was not found.");
  const rows = await db
    .selectFrom("chart_revisions as r")
    .leftJoin("users as u", "u.id", "r.author_id")
    .select(["r.revision", "r.title", "r.message", "r.author_id", "u.name as author_name", "r.created_at", "r.meta_json", "r.source_text"])
    .where("r.chart_id", "=", chartId)
    .where("r.band_id", "=", bandId)
    .orderBy("r.revision", "desc")
    .execute();
  return rows.map((r) => ({
    revision: r.revision,
    title: r.title,
    message: r.message,
    author: { id: r.author_id, name: r.author_name ?? "someone" },
    createdAt: r.created_at,
    meta: JSON.parse(r.meta_json) as ChartMeta,
    sourceText: r.source_text,
  }));
}

export async function restoreRevision(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  chartId: string,
  revision: number,
): Promise<WireChart> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  const old = await db
    .selectFrom("chart_revisions")
    .selectAll()
    .where("chart_id", "=", chartId)
    .where("band_id", "=", bandId)
    .where("revision", "=", revision)
    .executeTakeFirst();
  if (!old) throw new AppError("not_found", `Revision ${revision} of that chart was not found.`);
  const meta = JSON.parse(old.meta_json) as ChartMeta;
  let prepared: Pick<PreparedChart, "title" | "meta" | "bodyJson" | "sourceText">;
  try {
    // Re-read the text so the stored model matches today's parser.
    prepared = prepareChart({ title: old.title, ...meta, sourceText: old.source_text });
  } catch (err) {
    if (!(err instanceof AppError) && !(err instanceof ChartTextError)) throw err;
    prepared = { title: old.title, meta, bodyJson: old.body_json, sourceText: old.source_text };
  }
  const before = await loadChartRow(db, bandId, chartId);
  // Bringing a deleted chart back adds one to the book.
  if (before?.deleted_at) await assertPlanAllows(db, bandId, "chart");
  const row = await db.transaction().execute(async (trx) => {
    const current = await loadChartRow(trx, bandId, chartId);
    if (!current) throw new AppError("not_found", "That chart was not found.");
    const next: ChartRow = {
      ...current,
      title: prepared.title,
      composer: meta.composer,
      concert_key: meta.key,
      meter: meta.meter,
      tempo: meta.tempo,
      feel: meta.feel,
      body_json: prepared.bodyJson,
      source_text: prepared.sourceText,
      revision: current.revision + 1,
      updated_by: me.userId,
      updated_at: nowIso(),
      deleted_at: null,
    };
    await trx.updateTable("charts").set(next).where("id", "=", chartId).where("revision", "=", current.revision).execute();
    await writeRevision(trx, next, prepared, `Restored revision ${revision}`);
    return next;
  });
  return toWireChart(row, me.name);
}
