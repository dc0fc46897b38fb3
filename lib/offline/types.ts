// What the UI reads from the local book. Rows in Dexie carry a few internal fields on top.
import type { Chart } from "@/lib/chart/model";
import type { Role } from "@/lib/band/roles";
import type { MutationIn, RevisionMeta, WireAnnotation, WireAttachment, WireSetlist, WireSetlistEntry } from "./protocol";

export interface LocalSession {
  userId: string;
  email: string;
  name: string;
}

export interface LocalBand {
  id: string;
  name: string;
  role: Role;
  instrument: string;
}

export interface LocalMembership {
  bandId: string;
  role: Role;
  instrument: string;
  expiresAt: string | null;
}

export interface LocalMember {
  bandId: string;
  userId: string;
  name: string;
  email: string;
  role: Role;
  instrument: string;
  expiresAt: string | null;
}

export interface LocalChart {
  id: string;
  bandId: string;
  title: string;
  composer: string;
  concertKey: string;
  meter: string;
  tempo: number | null;
  feel: string;
  body: Chart;
  sourceText: string;
  /** The server revision this row is (or, with unsent edits, was) based on; 0 for a chart made offline. */
  revision: number;
  updatedAt: string;
  updatedBy: string;
  updatedByName: string;
  /** Changed by someone else since this user last opened it. */
  unseen: boolean;
  /** Set on a conflict copy: the id of the chart it was meant to change. */
  conflictOf?: string;
}

/** Internal fields of a stored chart row. */
export interface ChartRow extends LocalChart {
  /** The revision this user last opened (or saw when the book first arrived). */
  seenRevision: number;
  /** The revision read before the last opening: the change summary shows readFrom → revision. */
  readFrom?: number;
  /** Deleted here, delete not yet sent. */
  deleted?: boolean;
  /** This device has edits of this chart not yet accepted by the server. */
  localEdit?: boolean;
}

export interface LocalRevision {
  chartId: string;
  bandId: string;
  revision: number;
  title: string;
  message: string;
  authorName: string;
  createdAt: string;
  sourceText: string;
  meta: RevisionMeta;
}

export type LocalSetlist = Omit<WireSetlist, "entries">;

export interface LocalSetlistEntry extends WireSetlistEntry {
  bandId: string;
}

export interface LocalAnnotation extends WireAnnotation {
  bandId: string;
  localEdit?: boolean;
}

export interface LocalAttachment extends WireAttachment {
  bandId: string;
}

export interface LocalAttachmentFile {
  /** Attachment id. */
  id: string;
  blob: Blob;
  storedAt: string;
}

export interface SyncStateRow {
  bandId: string;
  cursor: number;
  scope: string | null;
  lastSyncedAt: string | null;
}

export type OutboxStatus = "pending" | "rejected";

export interface OutboxItem {
  seq?: number;
  mutationId: string;
  bandId: string;
  entity: string;
  entityId: string;
  op: "upsert" | "delete" | "restore";
  baseRevision: number | null;
  data?: unknown;
  /** Human label for lists ("Lantern Street"). */
  label: string;
  status: OutboxStatus;
  attempts: number;
  /** Not before this time (ISO): backoff after a failed push. */
  nextAttemptAt: string | null;
  createdAt: string;
  reason?: string;
  fields?: { field: string; message: string }[];
  /** The row as it was before this edit, to put back when the server refuses it. */
  before?: ChartRow | null;
}

export interface ConflictRow {
  /** The id of the conflict copy (a chart row with conflictOf set). */
  id: string;
  bandId: string;
  entity: string;
  entityId: string;
  /** What this device tried to save. */
  mutation: MutationIn;
  /** The server revision it clashed with. */
  serverRevision: number | null;
  createdAt: string;
}

export interface SessionRow extends LocalSession {
  key: "me";
  seenAt: string;
}

export interface SyncStatus {
  state: "online" | "offline" | "syncing" | "error";
  lastSyncedAt: string | null;
  pending: number;
  progress?: { received: number; total: number };
  error?: string;
}
