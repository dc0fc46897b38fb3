// The local book: one IndexedDB database per device, mirroring what this user may see.
// Versioned with Dexie; add a new `this.version(n)` block (with an upgrade when rows change shape), never edit an old one.
import Dexie, { type DexieOptions, type EntityTable, type Table } from "dexie";
import type {
  ChartRow,
  ConflictRow,
  LocalMark,
  LocalPart,
  LocalPartFile,
  LocalBand,
  LocalMember,
  LocalMembership,
  LocalRevision,
  LocalSetlist,
  LocalSetlistEntry,
  OutboxItem,
  SessionRow,
  SyncStateRow,
} from "./types";

export class LocalBook extends Dexie {
  bands!: EntityTable<LocalBand, "id">;
  memberships!: EntityTable<LocalMembership, "bandId">;
  members!: Table<LocalMember, [string, string]>;
  charts!: EntityTable<ChartRow, "id">;
  revisions!: Table<LocalRevision, [string, number]>;
  setlists!: EntityTable<LocalSetlist, "id">;
  setlistEntries!: EntityTable<LocalSetlistEntry, "id">;
  annotations!: EntityTable<LocalMark, "id">;
  attachments!: EntityTable<LocalPart, "id">;
  attachmentFiles!: EntityTable<LocalPartFile, "id">;
  syncState!: EntityTable<SyncStateRow, "bandId">;
  outbox!: EntityTable<OutboxItem, "seq">;
  conflicts!: EntityTable<ConflictRow, "id">;
  session!: EntityTable<SessionRow, "key">;

  constructor(name = "pedalpoint", options?: DexieOptions) {
    super(name, options);
    this.version(1).stores({
      bands: "id",
      memberships: "bandId",
      members: "[bandId+userId], bandId",
      charts: "id, bandId, conflictOf",
      revisions: "[chartId+revision], chartId, bandId",
      setlists: "id, bandId",
      setlistEntries: "id, setlistId, bandId, chartId",
      annotations: "id, bandId, chartId",
      attachments: "id, bandId, chartId",
      attachmentFiles: "id",
      syncState: "bandId",
      outbox: "++seq, &mutationId, bandId, entityId, status",
      conflicts: "id, bandId, entityId",
      session: "key",
    });
    // Chart rows took the wire chart's shape: `key` and `updatedBy: { id, name }` (were concertKey, updatedBy + updatedByName).
    this.version(2).upgrade(async (tx) => {
      await tx.table("charts").toCollection().modify((row: Record<string, unknown>) => toWireChartFields(row));
      await tx.table("outbox").toCollection().modify((item: { before?: Record<string, unknown> | null }) => {
        if (item.before) toWireChartFields(item.before);
      });
    });
  }

  /** Every table holding one band's data (not the session). */
  bandTables(): Table[] {
    return [
      this.memberships, this.members, this.charts, this.revisions, this.setlists, this.setlistEntries,
      this.annotations, this.attachments, this.syncState, this.outbox, this.conflicts,
    ];
  }
}

/** Rewrites a chart row stored before version 2 in place. */
function toWireChartFields(row: Record<string, unknown>): void {
  // A tab still running the old code may have stored a feed row in the new shape under old names: keep what is there.
  if (typeof row.key !== "string") row.key = typeof row.concertKey === "string" ? row.concertKey : ((row.body as { key?: string } | undefined)?.key ?? "");
  if (typeof row.updatedBy !== "object" || row.updatedBy === null) row.updatedBy = { id: row.updatedBy ?? "", name: row.updatedByName ?? "" };
  row.deletedAt ??= null;
  delete row.concertKey;
  delete row.updatedByName;
}

let shared: LocalBook | null = null;

/** The device's book. Browser only: call from effects, hooks and event handlers. */
export function getLocalBook(): LocalBook {
  shared ??= new LocalBook();
  return shared;
}

/** Tests and the simulation give each device its own database. */
export function setLocalBook(book: LocalBook | null): void {
  shared = book;
}

/** Removes everything this device holds for a band (the member left or was removed). */
export async function deleteBandData(book: LocalBook, bandId: string): Promise<void> {
  const files = await book.attachments.where("bandId").equals(bandId).primaryKeys();
  await book.transaction("rw", [...book.bandTables(), book.bands, book.attachmentFiles], async () => {
    await book.attachmentFiles.bulkDelete(files);
    for (const t of book.bandTables()) {
      if (t === book.memberships || t === book.syncState) await t.delete(bandId);
      else await t.where("bandId").equals(bandId).delete();
    }
    await book.bands.delete(bandId);
  });
}

/** Removes a chart and everything hanging off it on this device. */
export async function deleteChartLocally(book: LocalBook, chartId: string): Promise<void> {
  await book.charts.delete(chartId);
  await book.revisions.where("chartId").equals(chartId).delete();
  await book.annotations.where("chartId").equals(chartId).delete();
  const att = await book.attachments.where("chartId").equals(chartId).primaryKeys();
  await book.attachments.bulkDelete(att);
  await book.attachmentFiles.bulkDelete(att);
}
