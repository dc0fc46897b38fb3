import "server-only";
// Bringing MusicXML in: a preview that stores nothing, then a confirm that saves through the chart
// use case (so roles, validation and the plan limit apply exactly as for a typed chart).
// Also the one reader for uploaded files, shared with attachments: sizes are checked before the
// body is read, and reading stops at the limit, so a huge upload is never held in memory.
import type { Kysely } from "kysely";
import { z } from "zod";
import type { Database } from "@/db/schema";
import type { Chart } from "@/lib/chart/model";
import { ChartTextError } from "@/lib/chart/text-error";
import { parseChartText } from "@/lib/chart/text-parse";
import { serializeChart } from "@/lib/chart/text-serialize";
import { importScoreFile, MusicXmlError, MAX_MUSICXML_BYTES, type ImportReport } from "@/lib/musicxml";
import { requireMember, type Actor } from "./access";
import { createChart } from "./charts";
import { AppError, type ErrorCode } from "./errors";
import { parseInput } from "./input";
import type { WireChart } from "@/lib/wire";

export interface Upload {
  name: string;
  bytes: Uint8Array;
}

/** Room for the multipart envelope around the file itself. */
const ENVELOPE = 64 * 1024;

export async function readUpload(request: Request, maxBytes: number, what: string): Promise<Upload> {
  const mb = Math.round(maxBytes / 1024 / 1024);
  const tooBig = () => new AppError("payload_too_large", `That file is larger than ${mb} MB, the most Pedalpoint takes for ${what}.`);
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > maxBytes + ENVELOPE) throw tooBig();
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the file as multipart/form-data, in a field named \"file\".");
  }
  if (!request.body) throw new AppError("bad_request", "The upload is empty.");
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes + ENVELOPE) {
      await reader.cancel().catch(() => undefined);
      throw tooBig();
    }
    chunks.push(value);
  }
  let form: FormData;
  try {
    form = await new Response(new Blob(chunks as BlobPart[]), { headers: { "content-type": type } }).formData();
  } catch {
    throw new AppError("bad_request", "The upload could not be read as a form.");
  }
  const file = form.get("file");
  if (!file || typeof file === "string") {
    throw new AppError("bad_request", "Attach the file in a field named \"file\".", { fields: [{ field: "file", message: "Choose a file" }] });
  }
  if (file.size > maxBytes) throw tooBig();
  if (file.size === 0) throw new AppError("bad_request", "That file is empty.", { fields: [{ field: "file", message: "The file is empty" }] });
  return { name: (file.name || "upload").slice(0, 200), bytes: new Uint8Array(await file.arrayBuffer()) };
}

const MUSICXML_STATUS: Record<MusicXmlError["code"], ErrorCode> = {
  wrong_type: "unsupported_media_type",
  too_large: "payload_too_large",
  zip_limits: "payload_too_large",
  entities: "unprocessable",
  not_xml: "unprocessable",
  not_musicxml: "unprocessable",
  bad_zip: "unprocessable",
  unsupported: "unprocessable",
};

export interface ImportPreview {
  fileName: string;
  chart: Chart;
  /** The chart text that confirm will save. */
  sourceText: string;
  report: ImportReport;
}

export const MAX_IMPORT_BYTES = MAX_MUSICXML_BYTES;

/** Reads a MusicXML file into a chart and a report. Stores nothing. */
export async function previewImport(db: Kysely<Database>, actor: Actor | null, bandId: string, file: Upload): Promise<ImportPreview> {
  await requireMember(db, actor, bandId, "editCharts");
  if (!/\.(musicxml|xml|mxl)$/i.test(file.name) && !/^[^.]*$/.test(file.name)) {
    throw new AppError("unsupported_media_type", `"${file.name}" is not a MusicXML file. Pedalpoint imports .musicxml, .xml and compressed .mxl files.`);
  }
  let chart: Chart;
  let report: ImportReport;
  try {
    ({ chart, report } = importScoreFile(file.bytes, { fileName: file.name, fitChartText: true }));
  } catch (err) {
    if (err instanceof MusicXmlError) throw new AppError(MUSICXML_STATUS[err.code], err.message, { reason: err.code });
    throw err;
  }
  const sourceText = serializeChart(chart);
  try {
    parseChartText(sourceText);
  } catch (err) {
    // the import fits what chart text cannot say (lib/musicxml/fit.ts); reaching this is a gap in that, so say where
    const where = err instanceof ChartTextError ? ` (chart text line ${err.line}: ${err.message})` : "";
    throw new AppError("unprocessable", `This file was read, but the chart it makes could not be written as Pedalpoint chart text${where}.`);
  }
  return { fileName: file.name, chart, sourceText, report };
}

export const ImportConfirmSchema = z
  .object({
    fileName: z.string().trim().max(200).default(""),
    title: z.string().trim().min(1, "A chart needs a title").max(200),
    composer: z.string().trim().max(200).default(""),
    key: z.string().trim().max(4),
    meter: z.string().trim().max(5),
    tempo: z.number().int().min(20).max(400).nullable().default(null),
    feel: z.string().trim().max(60).default(""),
    sourceText: z.string().max(50_000, "The chart text is too long (50,000 characters at most)"),
  })
  .strict();

/** Saves a previewed import as a new chart. */
export async function confirmImport(db: Kysely<Database>, actor: Actor | null, bandId: string, input: unknown): Promise<WireChart> {
  await requireMember(db, actor, bandId, "editCharts");
  const data = parseInput(ImportConfirmSchema, input);
  const { fileName, ...chart } = data;
  return createChart(db, actor, bandId, { ...chart, message: fileName ? `Imported from ${fileName}`.slice(0, 200) : "Imported from MusicXML" });
}

/** The whole preview request: the role is checked before a byte of the upload is read. */
export async function previewImportRequest(db: Kysely<Database>, actor: Actor | null, bandId: string, request: Request): Promise<ImportPreview> {
  await requireMember(db, actor, bandId, "editCharts");
  return previewImport(db, actor, bandId, await readUpload(request, MAX_IMPORT_BYTES, "MusicXML"));
}
