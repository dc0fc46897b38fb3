// The sync wire format shared by the server feed (lib/server/sync*) and the device (lib/offline).
// Pure types and small zod schemas: no Dexie, no React, no database. The entities travel in the
// shapes of lib/wire.ts.
import { z } from "zod";
import type { Role } from "@/lib/band/roles";
import type { WireChart, WireMark, WireMember, WireMembership, WirePart, WireSetlist } from "@/lib/wire";

/** The feed always sends a chart with its history list. */
export type FeedChart = WireChart & Required<Pick<WireChart, "history">>;

export type PullEntity = "chart" | "setlist" | "annotation" | "attachment";

export type Change =
  | { entity: "chart"; id: string; op: "upsert"; data: FeedChart }
  | { entity: "setlist"; id: string; op: "upsert"; data: WireSetlist }
  | { entity: "annotation"; id: string; op: "upsert"; data: WireMark }
  | { entity: "attachment"; id: string; op: "upsert"; data: WirePart }
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
  | { mutationId: string; status: "applied"; revision: number; data?: WireChart | WireSetlist | WireMark | null }
  | { mutationId: string; status: "conflict"; current: WireChart | WireSetlist | WireMark | null }
  | { mutationId: string; status: "rejected"; reason: string; fields?: { field: string; message: string }[] };

export interface PushResponse {
  results: MutationResult[];
}

export interface BootstrapResponse {
  user: { id: string; email: string; name: string };
  bands: { id: string; name: string; role: Role; instrument: string; expiresAt: string | null }[];
}
