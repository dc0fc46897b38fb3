import "server-only";
import type { WirePart } from "@/lib/wire";
// PDF and image parts of a chart: the type is read from the file's first bytes (never trusted from
// the name or the browser), the size is capped, and the file is stored once under its sha256 in the
// part store (lib/server/part-store: the data folder, or object storage). Each upload adds a row and
// an "attachment" change so devices fetch it for offline use.
import type { Kysely } from "kysely";
import type { AttachmentRow, Database } from "@/db/schema";
import { requireMember, type Actor, signedIn } from "./access";
import { recordChange } from "./changes";
import { AppError } from "./errors";
import type { Upload } from "./imports";
import { peek, receiveFile, type IncomingFile } from "./upload-stream";
import { requireChartReader } from "./chart-access";
import { partStore, PartTooLarge, type StoredPart } from "./part-store";
import { newId, nowIso } from "./tokens";
import { parseInput } from "./input";
import { z } from "zod";
import { INSTRUMENT_IDS } from "@/lib/music/instruments";
import { IdSchema } from "@/lib/validation/common";

export const MAX_PART_BYTES = 20 * 1024 * 1024;
export const PART_TYPES = ["application/pdf", "image/png", "image/jpeg"] as const;
export type PartType = (typeof PART_TYPES)[number];

/** The file's type from its magic bytes: %PDF-, the PNG signature, or a JPEG start-of-image marker. */
export function sniffPart(b: Uint8Array): PartType | null {
  const starts = (sig: number[]) => sig.every((v, i) => b[i] === v);
  if (starts([0x25, 0x50, 0x44, 0x46, 0x2d])) return "application/pdf";
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "image/png";
  if (starts([0xff, 0xd8, 0xff])) return "image/jpeg";
  return null;
}

const PAGE_OBJECT = /\/Type\s*\/Page(?![s\w])/g;
/** Longest page-object mark that is still found across two chunks. */
const PAGE_CARRY = 256;

/**
 * A rough page count from the PDF's page objects, counted as the bytes stream past (a mark split
 * between two chunks counts once); the viewer counts exactly when it opens the file.
 */
export class PdfPageCounter {
  private carry = "";
  private count = 0;

  /** Counts the marks that end in this chunk and have the character after them in view. */
  feed(chunk: Uint8Array): void {
    this.scan(this.carry + Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength).toString("latin1"), { final: false });
  }

  pages(): number | null {
    this.scan(this.carry, { final: true });
    this.carry = "";
    return this.count > 0 ? this.count : null;
  }

  /** The previous scan counted marks ending before the carry's last character; this one counts from there. */
  private scan(text: string, { final }: { final: boolean }): void {
    const from = this.carry.length;
    const upTo = final ? text.length : text.length - 1; // the look-ahead needs the character after a mark
    for (const m of text.matchAll(PAGE_OBJECT)) {
      const end = m.index + m[0].length;
      if (end >= from && end <= upTo) this.count++;
    }
    this.carry = text.slice(-PAGE_CARRY);
  }
}

function toWirePart(r: AttachmentRow): WirePart {
  return {
    id: r.id, chartId: r.chart_id, filename: r.filename, sha256: r.sha256, size: r.size, type: r.type, pages: r.pages, createdAt: r.created_at,
    partName: r.part_name ?? null, instrument: r.instrument ?? null,
  };
}

async function requireChart(db: Kysely<Database>, bandId: string, chartId: string): Promise<void> {
  const chart = await db.selectFrom("charts").select("id").where("band_id", "=", bandId).where("id", "=", chartId).where("deleted_at", "is", null).executeTakeFirst();
  if (!chart) throw new AppError("not_found", "That chart was not found.");
}

const tooLarge = () => new AppError("payload_too_large", "That file is larger than 20 MB, the most Pedalpoint takes for a part.");

/** What the form says about the part: its name, the instrument it is for, and the part it replaces. */
export const PartDetailsSchema = z
  .object({
    partName: z.string().trim().min(1, "Give the part a name, such as “2nd trumpet”.").max(80, "Keep the part's name to 80 characters."),
    instrument: z.enum(INSTRUMENT_IDS, { message: "Choose the part it is for." }),
    replaces: IdSchema.optional(),
  })
  .strict();
export type PartDetails = z.infer<typeof PartDetailsSchema>;

/** The part's details from the form; a bare file (older clients, scripts) keeps its file name only. */
export function readPartDetails(fields: Record<string, string>): PartDetails | undefined {
  if (Object.keys(fields).length === 0) return undefined;
  return parseInput(PartDetailsSchema, fields, { fallback: "The part's details could not be read." });
}

async function requirePart(db: Kysely<Database>, bandId: string, chartId: string, id: string): Promise<void> {
  const found = await db.selectFrom("attachments").select("id").where("band_id", "=", bandId).where("chart_id", "=", chartId).where("id", "=", id).where("deleted_at", "is", null).executeTakeFirst();
  if (!found) throw new AppError("not_found", "The part to replace was not found; it may have been deleted.", { fields: [{ field: "replaces", message: "That part is gone" }] });
}

/** Stores a part as its bytes stream past: the type from its first bytes, the pages counted on the way. */
async function storePart(db: Kysely<Database>, actor: Actor, bandId: string, chartId: string, file: IncomingFile): Promise<WirePart> {
  // The form's fields come before the file, so they are checked before a byte is stored.
  const details = readPartDetails(file.fields ?? {});
  if (details?.replaces) await requirePart(db, bandId, chartId, details.replaces);
  const { head, all } = await peek(file.chunks, 8);
  if (head.byteLength === 0) throw new AppError("bad_request", "That file is empty.", { fields: [{ field: "file", message: "The file is empty" }] });
  const type = sniffPart(head);
  if (!type) throw new AppError("unsupported_media_type", "Pedalpoint takes PDF, PNG and JPEG files for parts; this file is none of those.");
  const counter = type === "application/pdf" ? new PdfPageCounter() : null;
  async function* counted(): AsyncGenerator<Uint8Array> {
    for await (const chunk of all) {
      counter?.feed(chunk);
      yield chunk;
    }
  }
  let stored: StoredPart;
  try {
    stored = await partStore().put(counted(), { maxBytes: MAX_PART_BYTES, type });
  } catch (err) {
    if (err instanceof PartTooLarge) throw tooLarge();
    throw err;
  }
  const row: AttachmentRow = {
    id: newId(),
    band_id: bandId,
    chart_id: chartId,
    filename: file.name.replace(/[\\/\u0000-\u001f]/g, "_").slice(0, 200) || "part",
    path: stored.key,
    sha256: stored.sha256,
    size: stored.size,
    type,
    pages: counter ? counter.pages() : 1,
    part_name: details?.partName ?? null,
    instrument: details?.instrument ?? null,
    uploaded_by: actor.userId,
    created_at: nowIso(),
    deleted_at: null,
  };
  await db.transaction().execute(async (trx) => {
    await trx.insertInto("attachments").values(row).execute();
    await recordChange(trx, { bandId, entity: "attachment", entityId: row.id, op: "upsert" });
    // A replacement takes the old part's place in the same step: nobody sees both, or neither.
    if (details?.replaces) {
      await trx.updateTable("attachments").set({ deleted_at: row.created_at }).where("id", "=", details.replaces).where("deleted_at", "is", null).execute();
      await recordChange(trx, { bandId, entity: "attachment", entityId: details.replaces, op: "delete" });
    }
  });
  return toWirePart(row);
}

async function* once(bytes: Uint8Array): AsyncGenerator<Uint8Array> {
  yield bytes;
}

/** A part already in memory (imports, tests): the same checks and store as an upload. */
export async function uploadPart(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, file: Upload): Promise<WirePart> {
  await requireMember(db, actor, bandId, "editCharts");
  await requireChart(db, bandId, chartId);
  if (file.bytes.byteLength > MAX_PART_BYTES) throw tooLarge();
  return storePart(db, signedIn(actor), bandId, chartId, { name: file.name, chunks: once(file.bytes) });
}

/** Members who read the book see a chart's parts; a sub sees those of charts shared with them. */
const requireReader = (db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string) => requireChartReader(db, actor, bandId, chartId, "not_found");

export async function listParts(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string): Promise<WirePart[]> {
  await requireReader(db, actor, bandId, chartId);
  const rows = await db.selectFrom("attachments").selectAll().where("band_id", "=", bandId).where("chart_id", "=", chartId).where("deleted_at", "is", null).orderBy("created_at").execute();
  return rows.map(toWirePart);
}

/** How long a signed address to a part in object storage stays good. */
export const SIGNED_URL_SECONDS = 60;

export type PartBody =
  | { dto: WirePart; stream: ReadableStream<Uint8Array>; size: number; url?: undefined }
  | { dto: WirePart; url: string; stream?: undefined };

/**
 * A part's bytes for a member: streamed from the store, or (object storage with
 * PARTS_SIGNED_URLS=1) a short-lived signed address to fetch them from directly.
 */
export async function openPart(
  db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, attachmentId: string,
): Promise<PartBody> {
  await requireReader(db, actor, bandId, chartId);
  const row = await db.selectFrom("attachments").selectAll().where("band_id", "=", bandId).where("chart_id", "=", chartId).where("id", "=", attachmentId).where("deleted_at", "is", null).executeTakeFirst();
  if (!row) throw new AppError("not_found", "That part was not found.");
  const store = partStore();
  const dto = toWirePart(row);
  if (process.env.PARTS_SIGNED_URLS === "1") {
    const url = await store.signedUrl(row.path, { filename: safeFilename(dto.filename), type: dto.type, seconds: SIGNED_URL_SECONDS });
    if (url) return { dto, url };
  }
  const body = await store.open(row.path);
  if (!body) throw new AppError("not_found", "That part's file is missing on the server.");
  return { dto, stream: body.stream, size: body.size };
}

/** The file name as a header value can carry it. */
export function safeFilename(name: string): string {
  return name.replace(/[^\x20-\x7e]/g, "_").replace(/"/g, "'");
}

export async function deletePart(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, attachmentId: string): Promise<void> {
  await requireMember(db, actor, bandId, "editCharts");
  const res = await db.updateTable("attachments").set({ deleted_at: nowIso() }).where("band_id", "=", bandId).where("chart_id", "=", chartId).where("id", "=", attachmentId).where("deleted_at", "is", null).executeTakeFirst();
  if (Number(res.numUpdatedRows) === 0) throw new AppError("not_found", "That part was not found.");
  await recordChange(db, { bandId, entity: "attachment", entityId: attachmentId, op: "delete" });
}

/** The whole upload request: role and chart are checked before the upload is read. */
export async function uploadPartRequest(db: Kysely<Database>, actor: Actor | null, bandId: string, chartId: string, request: Request): Promise<WirePart> {
  await requireMember(db, actor, bandId, "editCharts");
  await requireChart(db, bandId, chartId);
  // Streamed from the request into the part store: never the whole file in memory.
  return receiveFile(request, { maxBytes: MAX_PART_BYTES, what: "a part" }, (file) => storePart(db, signedIn(actor), bandId, chartId, file));
}
