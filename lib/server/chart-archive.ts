import "server-only";
// Putting a chart away and bringing it back. An archived chart is tombstoned in `charts` like a delete,
// so it leaves every device through the sync feed and stops counting toward the plan; its row in
// `chart_archive` lets a leader or arranger bring it back (a new revision, counted again).
import type { Kysely } from "kysely";
import type { ChartRow, Database } from "@/db/schema";
import { requireMember, type Actor, signedIn } from "./access";
import { assertPlanAllows } from "./billing";
import { loadChartRow, writeRevision } from "./chart-store";
import { AppError } from "./errors";
import { nowIso } from "./tokens";

export interface ArchivedChart {
  id: string;
  title: string;
  concertKey: string;
  archivedAt: string;
  archivedBy: string;
}

function unchanged(row: ChartRow) {
  return {
    title: row.title,
    meta: { composer: row.composer, key: row.concert_key, meter: row.meter, tempo: row.tempo, feel: row.feel },
    bodyJson: row.body_json,
    sourceText: row.source_text,
  };
}

export async function listArchivedCharts(db: Kysely<Database>, actor: Actor | null, bandId: string): Promise<ArchivedChart[]> {
  await requireMember(db, actor, bandId, "editCharts");
  const rows = await db
    .selectFrom("chart_archive as a")
    .innerJoin("charts as c", "c.id", "a.chart_id")
    .leftJoin("users as u", "u.id", "a.archived_by")
    .select(["c.id", "c.title", "c.concert_key", "a.archived_at", "u.name as archived_by"])
    .where("a.band_id", "=", bandId)
    .where("c.band_id", "=", bandId)
    .where("c.deleted_at", "is not", null)
    .orderBy("c.title")
    .execute();
  return rows.map((r) => ({ id: r.id, title: r.title, concertKey: r.concert_key, archivedAt: r.archived_at, archivedBy: r.archived_by ?? "someone" }));
}

export async function archiveChart(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, now = new Date()): Promise<{ id: string; revision: number }> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  return db.transaction().execute(async (trx) => {
    const current = await loadChartRow(trx, bandId, chartId);
    if (!current || current.deleted_at) throw new AppError("not_found", "That chart was not found.");
    const at = nowIso(now);
    const next: ChartRow = { ...current, revision: current.revision + 1, updated_by: me.userId, updated_at: at, deleted_at: at };
    await trx.updateTable("charts").set(next).where("id", "=", chartId).where("revision", "=", current.revision).execute();
    await writeRevision(trx, next, unchanged(current), "Archived the chart");
    await trx.deleteFrom("chart_archive").where("chart_id", "=", chartId).execute();
    await trx.insertInto("chart_archive").values({ chart_id: chartId, band_id: bandId, archived_at: at, archived_by: me.userId }).execute();
    return { id: chartId, revision: next.revision };
  });
}

async function archivedRow(db: Kysely<Database>, bandId: string, chartId: string): Promise<ChartRow> {
  const held = await db.selectFrom("chart_archive").select("chart_id").where("chart_id", "=", chartId).where("band_id", "=", bandId).executeTakeFirst();
  const row = held ? await loadChartRow(db, bandId, chartId) : undefined;
  if (!row || !row.deleted_at) throw new AppError("not_found", "That chart is not in the archive.");
  return row;
}

/** Back into the book on every device, as a new revision; counted toward the plan again. */
export async function bringBackChart(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, now = new Date()): Promise<{ id: string; revision: number }> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  await archivedRow(db, bandId, chartId);
  await assertPlanAllows(db, bandId, "chart", now);
  return db.transaction().execute(async (trx) => {
    const current = await loadChartRow(trx, bandId, chartId);
    if (!current || !current.deleted_at) throw new AppError("not_found", "That chart is not in the archive.");
    const next: ChartRow = { ...current, revision: current.revision + 1, updated_by: me.userId, updated_at: nowIso(now), deleted_at: null };
    await trx.updateTable("charts").set(next).where("id", "=", chartId).where("revision", "=", current.revision).execute();
    await writeRevision(trx, next, unchanged(current), "Brought back from the archive");
    await trx.deleteFrom("chart_archive").where("chart_id", "=", chartId).execute();
    return { id: chartId, revision: next.revision };
  });
}

/** Deletes an archived chart for good: it leaves the archive list (the tombstone stays, like any delete). */
export async function deleteArchivedChart(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string): Promise<{ id: string }> {
  await requireMember(db, actor, bandId, "editCharts");
  await archivedRow(db, bandId, chartId);
  await db.deleteFrom("chart_archive").where("chart_id", "=", chartId).where("band_id", "=", bandId).execute();
  return { id: chartId };
}
