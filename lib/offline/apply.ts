// Writing what the server says into the local book. Each pulled page lands in one transaction with
// its cursor, so a failure (a full disk, a closed tab) leaves the book as it was before the page.
import type { LocalBook } from "./db";
import { deleteChartLocally } from "./db";
import type { WireChart, WireMark, WirePart, WireSetlist } from "@/lib/wire";
import type { PullResponse } from "./protocol";
import type { ChartRow, LocalMark, LocalPart, LocalRevision } from "./types";

/** A chart as the device stores it, with the "changed since you last opened it" mark worked out. */
export function chartRowFrom(w: WireChart, prev: ChartRow | undefined, me: string | null, baseline: boolean): ChartRow {
  const mine = me !== null && w.updatedBy.id === me;
  let seen = prev ? prev.seenRevision : baseline ? w.revision : 0;
  if (mine) seen = Math.max(seen, w.revision);
  const row: ChartRow & { history?: unknown } = { ...w, seenRevision: seen, unseen: !mine && w.revision > seen };
  delete row.history; // kept in the revisions table
  return row;
}

export function revisionsFrom(w: WireChart): LocalRevision[] {
  return (w.history ?? []).map((h) => ({ ...h, sourceText: h.sourceText ?? w.sourceText, chartId: w.id, bandId: w.bandId }));
}

/** Every table a pulled page may touch. */
export function pageTables(book: LocalBook) {
  return [
    book.bands, book.memberships, book.members, book.charts, book.revisions, book.setlists, book.setlistEntries,
    book.annotations, book.attachments, book.attachmentFiles, book.syncState, book.outbox,
  ];
}

/** Ids of rows in this band with edits still waiting in the outbox: a pull must not overwrite them. */
async function pendingIds(book: LocalBook, bandId: string): Promise<Set<string>> {
  const items = await book.outbox.where("bandId").equals(bandId).toArray();
  return new Set(items.filter((i) => i.status === "pending").map((i) => i.entityId));
}

/** Stores a set list and replaces its entries. */
export async function putSetlist(book: LocalBook, bandId: string, s: WireSetlist): Promise<void> {
  const { entries, ...list } = s;
  await book.setlists.put({ ...list, bandId });
  await book.setlistEntries.where("setlistId").equals(s.id).delete();
  await book.setlistEntries.bulkPut(entries.map((e) => ({ ...e, bandId })));
}

/**
 * Applies one page of the feed. `me` is the signed-in user (their own edits are never marked as
 * unseen); `baseline` is true on a device's first sync of the band, when nothing counts as new.
 */
export async function applyPullPage(book: LocalBook, bandId: string, page: PullResponse, me: string | null, baseline: boolean): Promise<void> {
  await book.transaction("rw", pageTables(book), async () => {
    const pending = await pendingIds(book, bandId);
    await book.bands.put({ id: page.band.id, name: page.band.name, role: page.membership.role, instrument: page.membership.instrument });
    await book.memberships.put(page.membership);
    if (page.members) {
      await book.members.where("bandId").equals(bandId).delete();
      await book.members.bulkPut(page.members.map((m) => ({ ...m, bandId })));
    }
    const chartIds = page.changes.filter((c) => c.entity === "chart").map((c) => c.id);
    const prevRows = await book.charts.bulkGet(chartIds);
    const prev = new Map(prevRows.flatMap((r) => (r ? [[r.id, r] as const] : [])));
    const rows: ChartRow[] = [];
    const revisions: LocalRevision[] = [];
    for (const c of page.changes) {
      if (pending.has(c.id)) continue; // the push decides: applied, or kept as a conflict copy
      if (c.entity === "chart") {
        if (c.op === "delete") await deleteChartLocally(book, c.id);
        else {
          rows.push(chartRowFrom(c.data, prev.get(c.id), me, baseline));
          revisions.push(...revisionsFrom(c.data));
        }
      } else if (c.entity === "setlist") {
        if (c.op === "delete") {
          await book.setlists.delete(c.id);
          await book.setlistEntries.where("setlistId").equals(c.id).delete();
        } else await putSetlist(book, bandId, c.data);
      } else if (c.entity === "annotation") {
        if (c.op === "delete") await book.annotations.delete(c.id);
        else await book.annotations.put(markFrom(bandId, c.data));
      } else if (c.entity === "attachment") {
        if (c.op === "delete") {
          await book.attachments.delete(c.id);
          await book.attachmentFiles.delete(c.id);
        } else await book.attachments.put(partFrom(bandId, c.data));
      }
    }
    await book.charts.bulkPut(rows);
    await book.revisions.bulkPut(revisions);
    const prevState = await book.syncState.get(bandId);
    await book.syncState.put({
      bandId,
      cursor: page.seq,
      scope: page.scope,
      lastSyncedAt: page.more ? (prevState?.lastSyncedAt ?? null) : new Date().toISOString(),
    });
  });
}

function markFrom(bandId: string, a: WireMark): LocalMark {
  return { ...a, bandId };
}

function partFrom(bandId: string, a: WirePart): LocalPart {
  return { ...a, bandId };
}

/** Stores the server's version of one chart (after a save, or the current row on a conflict). */
export async function putServerChart(book: LocalBook, w: WireChart, me: string | null): Promise<ChartRow> {
  return book.transaction("rw", [book.charts, book.revisions], async () => {
    const row = chartRowFrom(w, await book.charts.get(w.id), me, true);
    await book.charts.put(row);
    await book.revisions.bulkPut(revisionsFrom(w));
    return row;
  });
}
