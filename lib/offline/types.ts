// What the UI reads from the local book. Rows in Dexie carry a few internal fields on top.
import type { Role } from "@/lib/band/roles";
import type { WireChart, WireMark, WireMember, WireMembership, WirePart, WireRevision, WireSetlist, WireSetlistEntry } from "@/lib/wire";
import type { MutationIn } from "./protocol";

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

export type LocalMembership = WireMembership;

export type LocalMember = WireMember & { bandId: string };

/** A chart on this device. `revision` is the server revision the row is (or, with unsent edits, was) based on; 0 for a chart made offline. */
export type LocalChart = Omit<WireChart, "history"> & {
  /** Changed by someone else since this user last opened it. */
  unseen: boolean;
  /** Set on a conflict copy: the id of the chart it was meant to change. */
  conflictOf?: string;
};

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

export type LocalRevision = Omit<WireRevision, "sourceText"> & { chartId: string; bandId: string; sourceText: string };

/** Rows stored by an older version may lack fields added since: `Partial` marks those. */
type StoredBefore<T, K extends keyof T> = Omit<T, K> & Partial<Pick<T, K>>;

/** Missing `setMinutes` reads as no lengths set. */
export type LocalSetlist = StoredBefore<Omit<WireSetlist, "entries">, "setMinutes">;

/** Missing `choruses` reads as 1, missing `straightIn` as false. */
export type LocalSetlistEntry = StoredBefore<WireSetlistEntry, "choruses" | "straightIn"> & { bandId: string };

export type LocalMark = WireMark & { bandId: string; localEdit?: boolean };

/** Missing `partName` and `instrument` read as not given. */
export type LocalPart = StoredBefore<WirePart, "partName" | "instrument"> & { bandId: string };

export interface LocalPartFile {
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
