// After a successful pull the device tells the server what it holds of the band's coming gigs: the
// sync cursor, and the revisions of those set lists, their charts and the parts stored here. It rides
// on the pull, so nothing is sent when there is no signal.
import type { LocalBook } from "./db";
import { deviceId, deviceLabel } from "./device";
import type { Transport } from "./transport";

/** Gigs that started up to 12 hours ago, or have no date, or are still to come. */
const PAST_MS = 12 * 3600_000;
const MAX_CHARTS = 500;

export interface HoldingsReport {
  deviceId: string;
  label: string;
  cursor: number;
  charts: Record<string, number>;
  setlists: Record<string, number>;
  parts: Record<string, string>;
}

export async function holdingsOf(book: LocalBook, bandId: string, now = new Date()): Promise<Omit<HoldingsReport, "deviceId" | "label">> {
  const lists = (await book.setlists.where("bandId").equals(bandId).toArray()).filter((s) => !s.startsAt || Date.parse(s.startsAt) >= now.getTime() - PAST_MS);
  const setlists: Record<string, number> = {};
  for (const s of lists) setlists[s.id] = s.revision;
  const entries = lists.length ? await book.setlistEntries.where("setlistId").anyOf(lists.map((s) => s.id)).toArray() : [];
  const chartIds = [...new Set(entries.map((e) => e.chartId))].slice(0, MAX_CHARTS);
  const charts: Record<string, number> = {};
  for (const c of await book.charts.bulkGet(chartIds)) if (c && !c.deleted && !c.conflictOf) charts[c.id] = c.revision;
  const parts: Record<string, string> = {};
  const atts = chartIds.length ? await book.attachments.where("chartId").anyOf(chartIds).toArray() : [];
  const stored = new Set((await book.attachmentFiles.bulkGet(atts.map((a) => a.id))).flatMap((f) => (f ? [f.id] : [])));
  for (const a of atts) if (stored.has(a.id)) parts[a.id] = a.sha256;
  const cursor = (await book.syncState.get(bandId))?.cursor ?? 0;
  return { cursor, charts, setlists, parts };
}

export async function reportHoldings(book: LocalBook, transport: Transport, bandId: string): Promise<void> {
  const held = await holdingsOf(book, bandId);
  const ua = typeof navigator === "undefined" ? "" : navigator.userAgent;
  const body: HoldingsReport = { deviceId: await deviceId(), label: deviceLabel(ua), ...held };
  await transport.fetch(`/api/bands/${encodeURIComponent(bandId)}/devices/report`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
}
