import "server-only";
// Personal marks: private to the player who made them, on charts they may read. Every change goes
// on the feed with the owner's id, so only that player's devices receive it.
import type { Kysely, Transaction } from "kysely";
import type { AnnotationRow, Database, Membership } from "@/db/schema";
import { ChartSchema, type Chart } from "@/lib/chart/model";
import { anchorFor, MarkInputSchema, MarkUpdateSchema, readMark, reanchorMark, type MarkData } from "@/lib/setlist";
import type { WireMark } from "@/lib/wire";
import { assertMay, requireMember, type Actor } from "./access";
import { recordChange } from "./changes";
import { AppError, notFound } from "./errors";
import { parseInput } from "./input";
import { sharedChartIds } from "./shares";
import { newId, nowIso } from "./tokens";
import { can } from "@/lib/band/roles";

type Db = Kysely<Database> | Transaction<Database>;

export function toMark(r: AnnotationRow): WireMark | null {
  let raw: unknown;
  try {
    raw = JSON.parse(r.data_json);
  } catch {
    return null;
  }
  const data = readMark(raw);
  return data ? { id: r.id, chartId: r.chart_id, revision: r.revision, updatedAt: r.updated_at, data } : null;
}

/** The chart as this member may read it, or 404 (a sub: only charts on a set list shared with them). */
async function readableChart(db: Db, m: Membership, chartId: string, now: Date): Promise<{ chart: Chart; revision: number }> {
  if (!can(m.role, "readBook") && !(await sharedChartIds(db, m.band_id, m.user_id, now)).includes(chartId)) throw notFound("That chart");
  const row = await db
    .selectFrom("charts")
    .select(["body_json", "revision"])
    .where("id", "=", chartId)
    .where("band_id", "=", m.band_id)
    .where("deleted_at", "is", null)
    .executeTakeFirst();
  if (!row) throw notFound("That chart");
  const parsed = ChartSchema.safeParse(JSON.parse(row.body_json));
  if (!parsed.success) throw new AppError("conflict", "That chart cannot be read right now; marks cannot be placed on it.");
  return { chart: parsed.data, revision: row.revision };
}

export async function listMyMarks(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId?: string): Promise<WireMark[]> {
  const m = await requireMember(db, actor, bandId, "personalMarks");
  let q = db.selectFrom("annotations").selectAll().where("band_id", "=", bandId).where("user_id", "=", m.user_id).where("deleted_at", "is", null);
  if (chartId) q = q.where("chart_id", "=", chartId);
  const rows = await q.orderBy("updated_at").execute();
  return rows.flatMap((r) => toMark(r) ?? []);
}

/** Checks that the anchor points at a bar of the current chart, and stamps the revision it was checked against. */
function placed(chart: Chart, revision: number, data: MarkData): MarkData {
  const a = data.anchor;
  const here = anchorFor(chart, a.section, a.bar);
  if (!here && !data.lost) {
    throw new AppError("unprocessable", "That bar is not in the chart.", { fields: [{ field: "data.anchor", message: "No such bar in this chart" }] });
  }
  return here ? { ...data, anchor: here, chartRevision: revision, lost: false } : data;
}

export interface SaveMarkOptions {
  id: string;
  chartId: string;
  data: MarkData;
  /** null: create (refused when the id is taken); a number: replace that revision (else a conflict). */
  baseRevision: number | null;
  now?: Date;
}

/**
 * Creates or replaces the member's own mark, as a member already resolved by the one access check.
 * Shared by the routes and the sync push.
 */
export async function saveMarkAs(db: Kysely<Database>, m: Membership, { id, chartId, data, baseRevision, now = new Date() }: SaveMarkOptions): Promise<WireMark> {
  assertMay(m, "personalMarks");
  const { chart, revision } = await readableChart(db, m, chartId, now);
  const checked = placed(chart, revision, data);
  return db.transaction().execute(async (trx) => {
    const current = await trx.selectFrom("annotations").selectAll().where("id", "=", id).executeTakeFirst();
    if (current && (current.user_id !== m.user_id || current.band_id !== m.band_id)) throw notFound("That mark");
    if (current && current.chart_id !== chartId) throw new AppError("unprocessable", "A mark cannot move to another chart.");
    if (baseRevision !== null && current && !current.deleted_at && current.revision !== baseRevision) {
      const mark = toMark(current);
      throw new AppError("conflict", "This mark was changed on another of your devices.", { current: mark });
    }
    if (baseRevision === null && current && !current.deleted_at) {
      throw new AppError("conflict", "A mark with that id already exists.", { current: toMark(current) });
    }
    const row: AnnotationRow = {
      id,
      user_id: m.user_id,
      band_id: m.band_id,
      chart_id: chartId,
      data_json: JSON.stringify(checked),
      revision: current ? current.revision + 1 : 1,
      updated_at: nowIso(now),
      deleted_at: null,
    };
    if (current) await trx.updateTable("annotations").set(row).where("id", "=", id).execute();
    else await trx.insertInto("annotations").values(row).execute();
    await recordChange(trx, { bandId: m.band_id, entity: "annotation", entityId: id, op: "upsert", userId: m.user_id });
    return toMark(row) as WireMark;
  });
}

/** Deletes the member's own mark, as a member already resolved by the one access check. */
export async function deleteMarkAs(db: Kysely<Database>, m: Membership, { id, now = new Date() }: { id: string; now?: Date }): Promise<void> {
  assertMay(m, "personalMarks");
  await db.transaction().execute(async (trx) => {
    const r = await trx
      .updateTable("annotations")
      .set({ deleted_at: nowIso(now), updated_at: nowIso(now) })
      .where("id", "=", id)
      .where("user_id", "=", m.user_id)
      .where("band_id", "=", m.band_id)
      .where("deleted_at", "is", null)
      .executeTakeFirst();
    if (Number(r.numUpdatedRows) !== 1) throw notFound("That mark");
    await recordChange(trx, { bandId: m.band_id, entity: "annotation", entityId: id, op: "delete", userId: m.user_id });
  });
}

export async function createMark(db: Kysely<Database>, actor: Actor | null, bandId: string, input: unknown, now = new Date()): Promise<WireMark> {
  const m = await requireMember(db, actor, bandId, "personalMarks");
  const data = parseInput(MarkInputSchema, input);
  return saveMarkAs(db, m, { id: data.id ?? newId(), chartId: data.chartId, data: data.data, baseRevision: null, now });
}

export async function updateMark(db: Kysely<Database>, actor: Actor | null, bandId: string, markId: string, input: unknown, now = new Date()): Promise<WireMark> {
  const m = await requireMember(db, actor, bandId, "personalMarks");
  const data = parseInput(MarkUpdateSchema, input);
  const current = await db.selectFrom("annotations").select(["chart_id", "user_id"]).where("id", "=", markId).where("band_id", "=", bandId).executeTakeFirst();
  if (!current || current.user_id !== m.user_id) throw notFound("That mark");
  return saveMarkAs(db, m, { id: markId, chartId: current.chart_id, data: data.data, baseRevision: data.baseRevision, now });
}

export async function deleteMark(db: Kysely<Database>, actor: Actor | null, bandId: string, markId: string, now = new Date()): Promise<void> {
  const m = await requireMember(db, actor, bandId, "personalMarks");
  await deleteMarkAs(db, m, { id: markId, now });
}

/**
 * Re-anchors every player's marks on a chart after the leader publishes a revision: each mark follows
 * its bar, or is flagged lost when the bar is gone. Call inside (or right after) the revision's write.
 * Returns how many marks moved or were flagged.
 */
export async function reanchorChartMarks(db: Db, bandId: string, chartId: string, chart: Chart, revision: number, now = new Date()): Promise<number> {
  const rows = await db
    .selectFrom("annotations")
    .selectAll()
    .where("band_id", "=", bandId)
    .where("chart_id", "=", chartId)
    .where("deleted_at", "is", null)
    .execute();
  let touched = 0;
  for (const r of rows) {
    const mark = toMark(r);
    if (!mark || mark.data.chartRevision >= revision) continue;
    const { data } = reanchorMark(chart, revision, mark.data);
    const moved = JSON.stringify(data.anchor) !== JSON.stringify(mark.data.anchor) || data.lost !== mark.data.lost;
    await db
      .updateTable("annotations")
      .set({ data_json: JSON.stringify(data), revision: r.revision + 1, updated_at: nowIso(now) })
      .where("id", "=", r.id)
      .execute();
    await recordChange(db, { bandId, entity: "annotation", entityId: r.id, op: "upsert", userId: r.user_id });
    if (moved) touched++;
  }
  return touched;
}
