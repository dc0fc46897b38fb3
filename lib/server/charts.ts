import "server-only";
// The band's book. Every published change bumps the chart's revision and writes, in one transaction,
// the chart row, a chart_revisions row and a changes row for delta sync. Deletes are tombstones.
import type { Kysely } from "kysely";
import type { ChartRow, Database } from "@/db/schema";
import { ChartCreateSchema, ChartUpdateSchema } from "@/lib/validation/chart-input";
import { requireChartReader } from "./chart-access";
import { requireMember, type Actor, signedIn } from "./access";
import { prepareChart, toWireChart, toChartSummary, type ChartSummary } from "./chart-body";
import { wireChart, loadChartRow, rowFields, writeRevision, type Db } from "./chart-store";
import { assertPlanAllows } from "./billing";
import { AppError } from "./errors";
import { parseInput } from "./input";
import { newId, nowIso } from "./tokens";
import type { WireChart } from "@/lib/wire";

export { listRevisions, restoreRevision, type RevisionDto } from "./chart-revisions";

export async function listCharts(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  opts: { includeDeleted?: boolean } = {},
): Promise<ChartSummary[]> {
  await requireMember(db, actor, bandId, "readBook");
  let q = db
    .selectFrom("charts as c")
    .leftJoin("users as u", "u.id", "c.updated_by")
    .selectAll("c")
    .select("u.name as author_name")
    .where("c.band_id", "=", bandId);
  if (!opts.includeDeleted) q = q.where("c.deleted_at", "is", null);
  const rows = await q.orderBy("c.title").execute();
  return rows.map(({ author_name, ...row }) => toChartSummary(row, author_name ?? "someone"));
}

export async function getChart(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string): Promise<WireChart> {
  await requireChartReader(db, actor, bandId, chartId);
  const row = await loadChartRow(db, bandId, chartId);
  if (!row || row.deleted_at) throw new AppError("not_found", "That chart was not found.");
  return wireChart(db, row);
}

export async function createChart(db: Kysely<Database>, actor: Actor | null, bandId: string, input: unknown): Promise<WireChart> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  const data = parseInput(ChartCreateSchema, input);
  await assertPlanAllows(db, bandId, "chart");
  const prepared = prepareChart(data);
  const row: ChartRow = {
    id: data.id ?? newId(),
    band_id: bandId,
    ...rowFields(prepared),
    revision: 1,
    updated_by: me.userId,
    updated_at: nowIso(),
    deleted_at: null,
  };
  await db.transaction().execute(async (trx) => {
    const taken = await trx.selectFrom("charts").select("id").where("id", "=", row.id).executeTakeFirst();
    if (taken) throw new AppError("conflict", "A chart with that id already exists.");
    await trx.insertInto("charts").values(row).execute();
    await writeRevision(trx, row, prepared, data.message || "Created the chart");
  });
  return toWireChart(row, me.name);
}

async function conflict(trx: Db, current: ChartRow): Promise<AppError> {
  const theirs = await wireChart(trx, current);
  const who = theirs.updatedBy.name;
  const what = current.deleted_at ? `${who} deleted this chart` : `${who} published revision ${current.revision}`;
  return new AppError("conflict", `${what} while you were editing. Your text is kept: compare and publish again.`, { current: theirs });
}

export async function updateChart(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  chartId: string,
  input: unknown,
): Promise<WireChart> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  const data = parseInput(ChartUpdateSchema, input);
  const prepared = prepareChart(data);
  const row = await db.transaction().execute(async (trx) => {
    const current = await loadChartRow(trx, bandId, chartId);
    if (!current) throw new AppError("not_found", "That chart was not found.");
    if (current.revision !== data.baseRevision || current.deleted_at) throw await conflict(trx, current);
    const next: ChartRow = { ...current, ...rowFields(prepared), revision: current.revision + 1, updated_by: me.userId, updated_at: nowIso() };
    const res = await trx
      .updateTable("charts")
      .set(next)
      .where("id", "=", chartId)
      .where("revision", "=", data.baseRevision)
      .executeTakeFirst();
    if (Number(res.numUpdatedRows) !== 1) throw await conflict(trx, (await loadChartRow(trx, bandId, chartId)) ?? current);
    await writeRevision(trx, next, prepared, data.message);
    return next;
  });
  return toWireChart(row, me.name);
}

export async function deleteChart(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  chartId: string,
  opts: { baseRevision?: number } = {},
): Promise<{ id: string; revision: number; deletedAt: string }> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  return db.transaction().execute(async (trx) => {
    const current = await loadChartRow(trx, bandId, chartId);
    if (!current || current.deleted_at) throw new AppError("not_found", "That chart was not found.");
    if (opts.baseRevision !== undefined && opts.baseRevision !== current.revision) throw await conflict(trx, current);
    const at = nowIso();
    const next: ChartRow = { ...current, revision: current.revision + 1, updated_by: me.userId, updated_at: at, deleted_at: at };
    await trx.updateTable("charts").set(next).where("id", "=", chartId).execute();
    await writeRevision(
      trx,
      next,
      {
        title: current.title,
        meta: { composer: current.composer, key: current.concert_key, meter: current.meter, tempo: current.tempo, feel: current.feel },
        bodyJson: current.body_json,
        sourceText: current.source_text,
      },
      "Deleted the chart",
    );
    return { id: chartId, revision: next.revision, deletedAt: at };
  });
}
