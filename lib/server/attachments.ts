import "server-only";
import type { WireAttachment } from "@/lib/offline/protocol";
// PDF and image parts of a chart: the type is read from the file's first bytes (never trusted from
// the name or the browser), the size is capped, and the file is stored once under its sha256 in the
// data folder. Each upload adds a row and an "attachment" change so devices fetch it for offline use.
import { createHash } from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import type { Kysely } from "kysely";
import type { AttachmentRow, Database } from "@/db/schema";
import { requireMember, type Actor } from "./access";
import { recordChange } from "./changes";
import { AppError } from "./errors";
import { readUpload, type Upload } from "./imports";
import { requireChartReader } from "./chart-access";
import { newId, nowIso } from "./tokens";

export const MAX_ATTACHMENT_BYTES = 20 * 1024 * 1024;
export const ATTACHMENT_TYPES = ["application/pdf", "image/png", "image/jpeg"] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];

/** The wire shape devices store (one definition, shared with the sync client). */
export type AttachmentDto = WireAttachment;

export function dataDir(): string {
  // the data folder is chosen at run time; the build must not trace it
  return path.resolve(/*turbopackIgnore: true*/ process.env.DATA_DIR ?? path.join(/*turbopackIgnore: true*/ process.cwd(), "data"));
}

/** The file's type from its magic bytes: %PDF-, the PNG signature, or a JPEG start-of-image marker. */
export function sniffAttachment(b: Uint8Array): AttachmentType | null {
  const starts = (sig: number[]) => sig.every((v, i) => b[i] === v);
  if (starts([0x25, 0x50, 0x44, 0x46, 0x2d])) return "application/pdf";
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "image/png";
  if (starts([0xff, 0xd8, 0xff])) return "image/jpeg";
  return null;
}

/** A rough page count from the PDF's page objects; the viewer counts exactly when it opens the file. */
function pdfPages(b: Uint8Array): number | null {
  const text = Buffer.from(b.buffer, b.byteOffset, b.byteLength).toString("latin1");
  const n = text.match(/\/Type\s*\/Page(?![s\w])/g)?.length ?? 0;
  return n > 0 ? n : null;
}

function toDto(r: AttachmentRow): AttachmentDto {
  return { id: r.id, chartId: r.chart_id, filename: r.filename, sha256: r.sha256, size: r.size, type: r.type, pages: r.pages, createdAt: r.created_at };
}

async function requireChart(db: Kysely<Database>, bandId: string, chartId: string): Promise<void> {
  const chart = await db.selectFrom("charts").select("id").where("band_id", "=", bandId).where("id", "=", chartId).where("deleted_at", "is", null).executeTakeFirst();
  if (!chart) throw new AppError("not_found", "That chart was not found.");
}

export async function uploadAttachment(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, file: Upload): Promise<AttachmentDto> {
  await requireMember(db, actor, bandId, "editCharts");
  await requireChart(db, bandId, chartId);
  if (file.bytes.byteLength > MAX_ATTACHMENT_BYTES) {
    throw new AppError("payload_too_large", "That file is larger than 20 MB, the most Pedalpoint takes for a part.");
  }
  const type = sniffAttachment(file.bytes);
  if (!type) throw new AppError("unsupported_media_type", "Pedalpoint takes PDF, PNG and JPEG files for parts; this file is none of those.");
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  const rel = path.posix.join("attachments", sha256);
  const abs = path.join(/*turbopackIgnore: true*/ dataDir(), "attachments", sha256);
  await fs.mkdir(path.dirname(abs), { recursive: true });
  const exists = await fs.stat(abs).then(() => true, () => false);
  if (!exists) {
    const tmp = `${abs}.${process.pid}.${Date.now()}.part`;
    await fs.writeFile(tmp, file.bytes);
    await fs.rename(tmp, abs);
  }
  const row: AttachmentRow = {
    id: newId(),
    band_id: bandId,
    chart_id: chartId,
    filename: file.name.replace(/[\\/\u0000-\u001f]/g, "_").slice(0, 200) || "part",
    path: rel,
    sha256,
    size: file.bytes.byteLength,
    type,
    pages: type === "application/pdf" ? pdfPages(file.bytes) : 1,
    uploaded_by: (actor as Actor).userId,
    created_at: nowIso(),
    deleted_at: null,
  };
  await db.transaction().execute(async (trx) => {
    await trx.insertInto("attachments").values(row).execute();
    await recordChange(trx, { bandId, entity: "attachment", entityId: row.id, op: "upsert" });
  });
  return toDto(row);
}

/** Members who read the book see a chart's parts; a sub sees those of charts shared with them. */
const requireReader = (db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string) => requireChartReader(db, actor, bandId, chartId, "not_found");

export async function listAttachments(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string): Promise<AttachmentDto[]> {
  await requireReader(db, actor, bandId, chartId);
  const rows = await db.selectFrom("attachments").selectAll().where("band_id", "=", bandId).where("chart_id", "=", chartId).where("deleted_at", "is", null).orderBy("created_at").execute();
  return rows.map(toDto);
}

export async function readAttachment(
  db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, attachmentId: string,
): Promise<{ dto: AttachmentDto; bytes: Buffer }> {
  await requireReader(db, actor, bandId, chartId);
  const row = await db.selectFrom("attachments").selectAll().where("band_id", "=", bandId).where("chart_id", "=", chartId).where("id", "=", attachmentId).where("deleted_at", "is", null).executeTakeFirst();
  if (!row) throw new AppError("not_found", "That part was not found.");
  const abs = path.join(/*turbopackIgnore: true*/ dataDir(), row.path);
  if (!abs.startsWith(dataDir() + path.sep)) throw new AppError("not_found", "That part was not found.");
  const bytes = await fs.readFile(abs).catch(() => null);
  if (!bytes) throw new AppError("not_found", "That part's file is missing on the server.");
  return { dto: toDto(row), bytes };
}

export async function deleteAttachment(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, attachmentId: string): Promise<void> {
  await requireMember(db, actor, bandId, "editCharts");
  const res = await db.updateTable("attachments").set({ deleted_at: nowIso() }).where("band_id", "=", bandId).where("chart_id", "=", chartId).where("id", "=", attachmentId).where("deleted_at", "is", null).executeTakeFirst();
  if (Number(res.numUpdatedRows) === 0) throw new AppError("not_found", "That part was not found.");
  await recordChange(db, { bandId, entity: "attachment", entityId: attachmentId, op: "delete" });
}

/** The whole upload request: role and chart are checked before the upload is read. */
export async function uploadAttachmentRequest(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, request: Request): Promise<AttachmentDto> {
  await requireMember(db, actor, bandId, "editCharts");
  await requireChart(db, bandId, chartId);
  return uploadAttachment(db, actor, bandId, chartId, await readUpload(request, MAX_ATTACHMENT_BYTES, "a part"));
}
