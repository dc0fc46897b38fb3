// The sync wire format shared by the server feed (lib/server/sync*) and the device (lib/offline).
// Pure types and small zod schemas: no Dexie, no React, no database.
import { z } from "zod";
import type { Chart, IntroChoice } from "@/lib/chart/model";
import type { Role } from "@/lib/band/roles";

/** Composer, key, meter, tempo and feel as they stood at a revision (stored by the backend as meta_json). */
export type RevisionMeta = Record<string, unknown>;

export interface WireRevision {
  revision: number;
  title: string;
  message: string;
  authorName: string;
  createdAt: string;
  /** Null for the chart's current revision: its text is the chart's own `sourceText` (sent once). */
  sourceText: string | null;
  meta: RevisionMeta;
}

export interface WireChart {
  id: string;
  bandId: string;
  title: string;
  composer: string;
  concertKey: string;
  meter: string;
  tempo: number | null;
  feel: string;
  revision: number;
  updatedAt: string;
  updatedBy: string;
  updatedByName: string;
  sourceText: string;
  /** The latest revisions, newest first (the history list). */
  history: WireRevision[];
  body: Chart;
}

export interface WireSetlistEntry {
  id: string;
  setlistId: string;
  setNumber: number;
  position: number;
  chartId: string;
  key: string | null;
  intro: IntroChoice | null;
  ending: unknown;
  tempo: number | null;
  soloOrder: string;
  /** Missing on rows stored before choruses were counted: read as 1. */
  choruses?: number;
  /** Missing on older rows: read as false. */
  straightIn?: boolean;
  notes: string;
}

export interface WireSetlist {
  id: string;
  bandId: string;
  name: string;
  startsAt: string | null;
  venue: string;
  notes: string;
  /** The leader's length for each set in minutes (index 0 = set 1); missing on older rows. */
  setMinutes?: (number | null)[];
  revision: number;
  updatedAt: string;
  updatedBy: string;
  entries: WireSetlistEntry[];
}

export interface WireAnnotation {
  id: string;
  chartId: string;
  revision: number;
  updatedAt: string;
  data: unknown;
}

export interface WireAttachment {
  id: string;
  chartId: string;
  filename: string;
  sha256: string;
  size: number;
  type: string;
  pages: number | null;
  createdAt: string;
  /** The part's name and instrument id (null on parts uploaded before they were asked). */
  partName?: string | null;
  instrument?: string | null;
}

export interface WireMember {
  userId: string;
  name: string;
  email: string;
  role: Role;
  instrument: string;
  expiresAt: string | null;
}

export interface WireMembership {
  bandId: string;
  role: Role;
  instrument: string;
  expiresAt: string | null;
}

export type PullEntity = "chart" | "setlist" | "annotation" | "attachment";

export type Change =
  | { entity: "chart"; id: string; op: "upsert"; data: WireChart }
  | { entity: "setlist"; id: string; op: "upsert"; data: WireSetlist }
  | { entity: "annotation"; id: string; op: "upsert"; data: WireAnnotation }
  | { entity: "attachment"; id: string; op: "upsert"; data: WireAttachment }
  | { entity: PullEntity; id: string; op: "delete"; data?: undefined };

export interface PullResponse {
  /** Cursor to send as `since` next time. */
  seq: number;
  more: boolean;
  /** Entities still to come from `since` (only when asked with count=1): progress on a first sync. */
  total?: number;
  /** What the caller may see; when it differs from the device's, the feed restarts from 0. */
  scope: string;
  band: { id: string; name: string };
  membership: WireMembership;
  /** The whole roster, for leaders, on a fresh feed or when membership changed. */
  members?: WireMember[];
  changes: Change[];
}

export const PullQuerySchema = z.object({
  since: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  scope: z.string().max(128).optional(),
  count: z.enum(["0", "1"]).optional(),
});
export type PullQuery = z.infer<typeof PullQuerySchema>;

export const MutationSchema = z.object({
  mutationId: z.string().min(8).max(64),
  entity: z.string().min(1).max(32),
  id: z.string().min(1).max(64),
  op: z.enum(["upsert", "delete", "restore"]).default("upsert"),
  baseRevision: z.number().int().min(0).nullable().default(null),
  data: z.unknown().optional(),
});
export type Mutation = z.infer<typeof MutationSchema>;
export type MutationIn = z.input<typeof MutationSchema>;

export const PushBodySchema = z.object({ mutations: z.array(MutationSchema).max(200) }).strict();

export type MutationResult =
  | { mutationId: string; status: "applied"; revision: number; data?: WireChart | WireSetlist | WireAnnotation | null }
  | { mutationId: string; status: "conflict"; current: WireChart | WireSetlist | WireAnnotation | null }
  | { mutationId: string; status: "rejected"; reason: string; fields?: { field: string; message: string }[] };

export interface PushResponse {
  results: MutationResult[];
}

export interface BootstrapResponse {
  user: { id: string; email: string; name: string };
  bands: { id: string; name: string; role: Role; instrument: string; expiresAt: string | null }[];
}
