import "server-only";
// Row-level helpers shared by the chart use cases (and the sync push, which applies chart edits).
import type { Kysely, Transaction } from "kysely";
import type { ChartRow, Database } from "@/db/schema";
import { ChartSchema } from "@/lib/chart/model";
import { reanchorChartMarks } from "./marks";
import { recordChange } from "./changes";
import { toWireChart, type PreparedChart } from "./chart-body";
import { newId } from "./tokens";
import type { WireChart } from "@/lib/wire";

export type Db = Kysely<Database> | Transaction<Database>;

export async function authorName(db: Db, userId: string): Promise<string> {
  const u = await db.selectFrom("users").select("name").where("id", "=", userId).executeTakeFirst();
  return u?.name ?? "someone";
}

export async function loadChartRow(db: Db, bandId: string, chartId: string): Promise<ChartRow | undefined> {
  return db.selectFrom("charts").selectAll().where("id", "=", chartId).where("band_id", "=", bandId).executeTakeFirst();
}

export async function wireChart(db: Db, row: ChartRow): Promise<WireChart> {
  return toWireChart(row, await authorName(db, row.updated_by));
}

/** Writes one published revision: the chart row is already updated or inserted by the caller. */
export async function writeRevision(
  trx: Transaction<Database>,
  row: ChartRow,
  prepared: Pick<PreparedChart, "title" | "meta" | "bodyJson" | "sourceText">,
  message: string,
): Promise<void> {
  await trx
    .insertInto("chart_revisions")
    .values({
      id: newId(),
      chart_id: row.id,
      band_id: row.band_id,
      revision: row.revision,
      title: prepared.title,
      body_json: prepared.bodyJson,
      source_text: prepared.sourceText,
      meta_json: JSON.stringify(prepared.meta),
      message,
      author_id: row.updated_by,
      created_at: row.updated_at,
    })
    .execute();
  await recordChange(trx, { bandId: row.band_id, entity: "chart", entityId: row.id, op: row.deleted_at ? "delete" : "upsert" });
  // Players' personal marks follow their bars into the new revision (or are flagged when a bar is gone).
  if (!row.deleted_at && row.revision > 1) {
    const body = ChartSchema.safeParse(JSON.parse(prepared.bodyJson));
    if (body.success) await reanchorChartMarks(trx, row.band_id, row.id, body.data, row.revision, new Date(row.updated_at));
  }
}

export function rowFields(p: PreparedChart) {
  return {
    title: p.title,
    composer: p.meta.composer,
    concert_key: p.meta.key,
    meter: p.meta.meter,
    tempo: p.meta.tempo,
    feel: p.meta.feel,
    body_json: p.bodyJson,
    source_text: p.sourceText,
  };
}

