"use client";
// Chart writes from the pages, through send() (./send.ts): online straight to the REST routes, the
// answer landing in the local book; else written locally and queued in the outbox for the next sync.
// The same checks run here first, so a bad chart text is caught offline too.
import { ChartTextError, joinChartText } from "@/lib/chart";
import type { Chart } from "@/lib/chart/model";
import { ChartCreateSchema, ChartUpdateSchema, type ChartCreate, type ChartUpdate } from "@/lib/validation/chart-input";
import { zodIssues } from "@/lib/validation/issues";
import type { WireChart } from "@/lib/wire";
import type { FieldProblem } from "@/lib/api-error";
import { putServerChart } from "./apply";
import { deleteChartLocally, getLocalBook, type LocalBook } from "./db";
import { enqueue, newId } from "./outbox";
import { hasQueued, refusal, send, settle, whoAmI, type DeleteResult, type SaveResult } from "./send";
import { getSyncEngine, requestBackgroundSync } from "./sync";
import type { ChartRow, LocalChart } from "./types";

export type ChartSaveInput = ChartCreate | (ChartUpdate & { id: string });

/** The chart model for the local copy, the form's metadata winning over the text's header (as on the server). */
function localBody(input: ChartCreate | ChartUpdate): Chart | FieldProblem[] {
  try {
    return joinChartText(input, input.sourceText);
  } catch (err) {
    if (err instanceof ChartTextError) return [{ field: "sourceText", message: err.message, line: err.line, column: err.column }];
    return [{ field: "sourceText", message: "The chart text could not be read." }];
  }
}

/** Stores the server's chart and fetches its history list with the next sync. */
async function settleChart(book: LocalBook, bandId: string, res: Response): Promise<SaveResult<LocalChart>> {
  const me = (await whoAmI(book))?.id ?? null;
  const r = await settle<WireChart, ChartRow>(res, "chart", (w) => putServerChart(book, w, me), "The server did not accept this change.");
  if (r.status === "saved") void getSyncEngine().sync({ bandId, force: false }); // brings the history list along
  return r;
}

function queued(row: ChartRow): SaveResult<LocalChart> {
  void requestBackgroundSync();
  return { status: "queued", row };
}

/** Creates or updates a chart (see the file header for online/offline behaviour). */
export async function saveChart(bandId: string, input: ChartSaveInput): Promise<SaveResult<LocalChart>> {
  const book = getLocalBook();
  const isUpdate = "baseRevision" in input && typeof input.baseRevision === "number";
  const checked = isUpdate ? ChartUpdateSchema.safeParse(stripId(input)) : ChartCreateSchema.safeParse(input);
  if (!checked.success) {
    const fields = zodIssues(checked.error, { whole: "(form)" });
    return { status: "invalid", fields, message: fields[0] ? `${fields[0].field}: ${fields[0].message}` : "Check the form." };
  }
  const data = checked.data;
  const body = localBody(data);
  if (Array.isArray(body)) return { status: "invalid", fields: body, message: `Line ${body[0]?.line ?? 1}: ${body[0]?.message ?? ""}` };
  const id = isUpdate ? (input as { id: string }).id : ((input as ChartCreate).id ?? newId());
  const base = isUpdate ? (data as ChartUpdate).baseRevision : null;
  const fields = chartFields(data);

  if (!(await hasQueued(book, id))) {
    const sent = isUpdate
      ? await send(bandId, `/charts/${enc(id)}`, { method: "PUT", body: JSON.stringify(data) })
      : await send(bandId, "/charts", { method: "POST", body: JSON.stringify({ ...data, id }) });
    if (sent.kind === "answer") return settleChart(book, bandId, sent.res);
  }
  const user = await whoAmI(book);
  const before = (await book.charts.get(id)) ?? null;
  const row: ChartRow = {
    id, bandId, title: data.title, composer: data.composer, key: data.key, meter: data.meter, tempo: data.tempo, feel: data.feel,
    body, sourceText: data.sourceText, revision: before?.revision ?? 0, updatedAt: new Date().toISOString(),
    updatedBy: { id: user?.id ?? "", name: user?.name ?? "" }, deletedAt: null, unseen: false, seenRevision: before?.seenRevision ?? 0, localEdit: true,
  };
  await book.transaction("rw", book.charts, book.outbox, async () => {
    await book.charts.put(row);
    await enqueue(book, { bandId, entity: "chart", entityId: id, op: "upsert", baseRevision: base, data: fields, label: data.title, before });
  });
  return queued(row);
}

export async function deleteChart(bandId: string, chartId: string, baseRevision?: number): Promise<DeleteResult<LocalChart>> {
  const book = getLocalBook();
  const local = await book.charts.get(chartId);
  const base = baseRevision ?? local?.revision;
  if (!(await hasQueued(book, chartId)) && base) {
    const sent = await send(bandId, `/charts/${enc(chartId)}?baseRevision=${base}`, { method: "DELETE" });
    if (sent.kind === "answer") {
      if (sent.res.ok) {
        await book.transaction("rw", book.charts, book.revisions, book.annotations, book.attachments, book.attachmentFiles, async () => {
          await deleteChartLocally(book, chartId);
        });
        return { status: "saved" };
      }
      return refusal(await settleChart(book, bandId, sent.res));
    }
  }
  await book.transaction("rw", book.charts, book.outbox, async () => {
    if (local) await book.charts.update(chartId, { deleted: true, localEdit: true });
    await enqueue(book, { bandId, entity: "chart", entityId: chartId, op: "delete", baseRevision: base ?? null, label: local?.title ?? "a chart", before: local ?? null });
  });
  void requestBackgroundSync();
  return { status: "queued" };
}

/** Makes an earlier revision the current chart again (a new revision on the server). */
export async function restoreRevision(bandId: string, chartId: string, revision: number): Promise<SaveResult<LocalChart>> {
  const book = getLocalBook();
  if (!(await hasQueued(book, chartId))) {
    const sent = await send(bandId, `/charts/${enc(chartId)}/revisions/${revision}/restore`, { method: "POST", body: "{}" });
    if (sent.kind === "answer") return settleChart(book, bandId, sent.res);
  }
  const local = await book.charts.get(chartId);
  const old = await book.revisions.get([chartId, revision]);
  if (!local) return { status: "invalid", fields: [], message: "That chart is not on this device." };
  let row: ChartRow = { ...local, localEdit: true };
  if (old) {
    const meta = old.meta as { composer?: string; key?: string; meter?: string; tempo?: number | null; feel?: string };
    const input = {
      title: old.title, composer: meta.composer ?? local.composer, key: meta.key ?? local.key, meter: meta.meter ?? local.meter,
      tempo: meta.tempo ?? null, feel: meta.feel ?? local.feel, sourceText: old.sourceText, message: "",
    };
    const body = localBody(input);
    row = { ...row, title: input.title, composer: input.composer, key: input.key, meter: input.meter, tempo: input.tempo, feel: input.feel, sourceText: old.sourceText, ...(Array.isArray(body) ? {} : { body }) };
  }
  await book.transaction("rw", book.charts, book.outbox, async () => {
    await book.charts.put(row);
    await enqueue(book, { bandId, entity: "chart", entityId: chartId, op: "restore", baseRevision: local.revision, data: { revision }, label: local.title, before: local });
  });
  return queued(row);
}

/** What travels in a queued chart mutation: the form's fields, without the id or base revision. */
function chartFields(d: ChartCreate | ChartUpdate) {
  return { title: d.title, composer: d.composer, key: d.key, meter: d.meter, tempo: d.tempo, feel: d.feel, sourceText: d.sourceText, message: d.message };
}

function stripId(input: ChartSaveInput): Record<string, unknown> {
  return Object.fromEntries(Object.entries(input).filter(([k]) => k !== "id"));
}

function enc(s: string): string {
  return encodeURIComponent(s);
}
