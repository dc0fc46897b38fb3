"use client";
// Writes from the pages. Online they go straight to the REST routes and the answer lands in the
// local book; with no signal (or no answer) the edit is written locally and queued in the outbox,
// and the next sync sends it. The same checks run here first, so a bad chart text is caught offline too.
import { ChartTextError, joinChartText } from "@/lib/chart";
import type { Chart } from "@/lib/chart/model";
import { ChartCreateSchema, ChartUpdateSchema, type ChartCreate, type ChartUpdate } from "@/lib/validation/chart-input";
import { zodIssues } from "@/lib/validation/issues";
import type { WireChart } from "@/lib/wire";
import { putServerChart } from "./apply";
import { deleteChartLocally, getLocalBook, type LocalBook } from "./db";
import { enqueue, newId } from "./outbox";
import { getSyncEngine, requestBackgroundSync } from "./sync";
import type { ChartRow, LocalChart } from "./types";

export interface FieldProblem {
  field: string;
  message: string;
  line?: number;
  column?: number;
}

export type SaveResult =
  | { status: "saved"; chart: LocalChart }
  | { status: "queued"; chart: LocalChart }
  | { status: "conflict"; current: LocalChart; message: string }
  | { status: "invalid"; fields: FieldProblem[]; message: string };

export type ChartSaveInput = ChartCreate | (ChartUpdate & { id: string });

interface ErrorBody {
  error?: { code?: string; message?: string; fields?: FieldProblem[]; current?: WireChart };
}

/** The chart model for the local copy, the form's metadata winning over the text's header (as on the server). */
function localBody(input: ChartCreate | ChartUpdate): Chart | FieldProblem[] {
  try {
    return joinChartText(input, input.sourceText);
  } catch (err) {
    if (err instanceof ChartTextError) return [{ field: "sourceText", message: err.message, line: err.line, column: err.column }];
    return [{ field: "sourceText", message: "The chart text could not be read." }];
  }
}

async function me(book: LocalBook) {
  return (await book.session.get("me")) ?? null;
}

function online(): boolean {
  return typeof navigator === "undefined" || navigator.onLine !== false;
}

async function hasQueued(book: LocalBook, entityId: string): Promise<boolean> {
  return (await book.outbox.where("entityId").equals(entityId).toArray()).some((i) => i.status === "pending");
}

type Sent = { kind: "answer"; res: Response } | { kind: "unreachable" };

async function send(path: string, init: RequestInit): Promise<Sent> {
  if (!online()) return { kind: "unreachable" };
  try {
    const res = await fetch(path, { credentials: "same-origin", cache: "no-store", headers: { "content-type": "application/json" }, ...init });
    // No session or a failing server: keep the edit here and let sync send it later.
    if (res.status === 401 || res.status >= 500) return { kind: "unreachable" };
    return { kind: "answer", res };
  } catch {
    return { kind: "unreachable" };
  }
}

async function answerToResult(book: LocalBook, bandId: string, res: Response): Promise<SaveResult> {
  const who = (await me(book))?.userId ?? null;
  const body = (await res.json().catch(() => ({}))) as { chart?: WireChart } & ErrorBody;
  if (res.ok && body.chart) {
    const row = await putServerChart(book, body.chart, who);
    void getSyncEngine().sync({ bandId, force: false }); // brings the history list along
    return { status: "saved", chart: row };
  }
  const message = body.error?.message ?? "The server did not accept this change.";
  if (res.status === 409 && body.error?.current) {
    const row = await putServerChart(book, body.error.current, who);
    return { status: "conflict", current: row, message };
  }
  return { status: "invalid", fields: body.error?.fields ?? [], message };
}

async function queued(book: LocalBook, row: ChartRow): Promise<SaveResult> {
  void requestBackgroundSync();
  return { status: "queued", chart: row };
}

/** Creates or updates a chart (see the file header for online/offline behaviour). */
export async function saveChart(bandId: string, input: ChartSaveInput): Promise<SaveResult> {
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
      ? await send(`/api/bands/${enc(bandId)}/charts/${enc(id)}`, { method: "PUT", body: JSON.stringify(data) })
      : await send(`/api/bands/${enc(bandId)}/charts`, { method: "POST", body: JSON.stringify({ ...data, id }) });
    if (sent.kind === "answer") return answerToResult(book, bandId, sent.res);
  }
  const user = await me(book);
  const before = (await book.charts.get(id)) ?? null;
  const row: ChartRow = {
    id, bandId, title: data.title, composer: data.composer, key: data.key, meter: data.meter, tempo: data.tempo, feel: data.feel,
    body, sourceText: data.sourceText, revision: before?.revision ?? 0, updatedAt: new Date().toISOString(),
    updatedBy: { id: user?.userId ?? "", name: user?.name ?? "" }, deletedAt: null, unseen: false, seenRevision: before?.seenRevision ?? 0, localEdit: true,
  };
  await book.transaction("rw", book.charts, book.outbox, async () => {
    await book.charts.put(row);
    await enqueue(book, { bandId, entity: "chart", entityId: id, op: "upsert", baseRevision: base, data: fields, label: data.title, before });
  });
  return queued(book, row);
}

export type DeleteResult = { status: "saved" } | { status: "queued" } | { status: "conflict"; current: LocalChart; message: string } | { status: "invalid"; fields: FieldProblem[]; message: string };

export async function deleteChart(bandId: string, chartId: string, baseRevision?: number): Promise<DeleteResult> {
  const book = getLocalBook();
  const local = await book.charts.get(chartId);
  const base = baseRevision ?? local?.revision;
  if (!(await hasQueued(book, chartId)) && base) {
    const sent = await send(`/api/bands/${enc(bandId)}/charts/${enc(chartId)}?baseRevision=${base}`, { method: "DELETE" });
    if (sent.kind === "answer") {
      if (sent.res.ok) {
        await book.transaction("rw", book.charts, book.revisions, book.annotations, book.attachments, book.attachmentFiles, async () => {
          await deleteChartLocally(book, chartId);
        });
        return { status: "saved" };
      }
      const r = await answerToResult(book, bandId, sent.res);
      return r.status === "saved" || r.status === "queued" ? { status: "saved" } : r;
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
export async function restoreRevision(bandId: string, chartId: string, revision: number): Promise<SaveResult> {
  const book = getLocalBook();
  if (!(await hasQueued(book, chartId))) {
    const sent = await send(`/api/bands/${enc(bandId)}/charts/${enc(chartId)}/revisions/${revision}/restore`, { method: "POST", body: "{}" });
    if (sent.kind === "answer") return answerToResult(book, bandId, sent.res);
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
  return queued(book, row);
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
