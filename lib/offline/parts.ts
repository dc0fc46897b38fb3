// PDF and image parts on the device. The sync feed brings each part's metadata into `attachments`;
// this fetches the files themselves into `attachmentFiles` while there is signal, checking each
// against its sha256, so the bandstand can open them with none. Call it after a sync.
import type { LocalBook } from "./db";
import type { LocalPart } from "./types";

export interface FetchFilesResult {
  fetched: string[];
  failed: string[];
}

export function attachmentUrl(a: Pick<LocalPart, "bandId" | "chartId" | "id">): string {
  return `/api/bands/${encodeURIComponent(a.bandId)}/charts/${encodeURIComponent(a.chartId)}/attachments/${encodeURIComponent(a.id)}`;
}

async function sha256Hex(bytes: ArrayBuffer): Promise<string> {
  const digest = await crypto.subtle.digest("SHA-256", bytes);
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
}

/** Downloads every part of the band (or of one chart) that the device does not hold yet. */
export async function fetchMissingPartFiles(
  book: LocalBook,
  bandId: string,
  opts: { chartId?: string; fetcher?: (url: string, init?: RequestInit) => Promise<Response>; now?: () => Date } = {},
): Promise<FetchFilesResult> {
  const fetcher = opts.fetcher ?? ((url: string, init?: RequestInit) => fetch(url, init));
  const rows = opts.chartId
    ? (await book.attachments.where("chartId").equals(opts.chartId).toArray()).filter((a) => a.bandId === bandId)
    : await book.attachments.where("bandId").equals(bandId).toArray();
  const held = new Set(await book.attachmentFiles.where("id").anyOf(rows.map((r) => r.id)).primaryKeys());
  const result: FetchFilesResult = { fetched: [], failed: [] };
  for (const a of rows) {
    if (held.has(a.id)) continue;
    try {
      const res = await fetcher(attachmentUrl(a), { credentials: "same-origin" });
      if (!res.ok) throw new Error(`HTTP ${res.status}`);
      const bytes = await res.arrayBuffer();
      // a cut-off or swapped download is not kept: the next sync tries again
      if ((await sha256Hex(bytes)) !== a.sha256) throw new Error("checksum mismatch");
      // the metadata may have been removed by a sync while the file was downloading
      if (!(await book.attachments.get(a.id))) continue;
      await book.attachmentFiles.put({ id: a.id, blob: new Blob([bytes], { type: a.type }), storedAt: (opts.now?.() ?? new Date()).toISOString() });
      result.fetched.push(a.id);
    } catch {
      result.failed.push(a.id);
    }
  }
  return result;
}

/** The stored file of a part, or null when this device has not fetched it yet. */
export async function readPartFile(book: LocalBook, attachmentId: string): Promise<Blob | null> {
  return (await book.attachmentFiles.get(attachmentId))?.blob ?? null;
}

/** A chart's parts on this device, each with whether its file is here for offline reading. */
export async function chartParts(book: LocalBook, chartId: string): Promise<(LocalPart & { offline: boolean })[]> {
  const rows = await book.attachments.where("chartId").equals(chartId).sortBy("createdAt");
  const held = new Set(await book.attachmentFiles.where("id").anyOf(rows.map((r) => r.id)).primaryKeys());
  return rows.map((r) => ({ ...r, offline: held.has(r.id) }));
}
