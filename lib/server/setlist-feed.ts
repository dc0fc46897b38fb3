import "server-only";
// What the sync feed needs from set lists and marks: loaders that turn changed ids into wire rows
// (filtered by what the caller may see) and push handlers for the device's outbox.
import type { Kysely } from "kysely";
import type { Database, Membership } from "@/db/schema";
import type { Mutation, MutationResult } from "@/lib/offline/protocol";
import type { WireMark, WireSetlist } from "@/lib/wire";
import { MarkDataSchema, SetlistInputSchema } from "@/lib/setlist";
import { z } from "zod";
import { assertMay } from "./access";
import { deleteMarkAs, saveMarkAs, toMark } from "./marks";
import { AppError } from "./errors";
import { deleteSetlistAs, loadSetlists, saveSetlistAs } from "./setlists";
import { sharedSetlistIds } from "./shares";
import { parseInput } from "./input";
import { can } from "@/lib/band/roles";

export type FeedRow<T> = { id: string; op: "upsert"; data: T } | { id: string; op: "delete" };

/**
 * Set lists for the feed, in the order of `ids`. Deleted ones, and for a sub those not (or no longer)
 * shared with them, come back as deletes so the device drops them.
 */
export async function loadSetlistFeedRows(
  db: Kysely<Database>,
  membership: Membership,
  ids: readonly string[],
  now = new Date(),
): Promise<FeedRow<WireSetlist>[]> {
  const unique = [...new Set(ids)];
  const visible = !can(membership.role, "readAllSetlists") ? new Set(await sharedSetlistIds(db, membership.band_id, membership.user_id, now)) : null;
  const found = await loadSetlists(db, membership.band_id, visible ? unique.filter((id) => visible.has(id)) : unique);
  return unique.map((id): FeedRow<WireSetlist> => {
    const f = found.get(id);
    if (!f || f.row.deleted_at) return { id, op: "delete" };
    return { id, op: "upsert", data: f.setlist };
  });
}

/** The caller's own marks for the feed; anyone else's are never returned (not even as deletes). */
export async function loadMarkFeedRows(
  db: Kysely<Database>,
  membership: Membership,
  ids: readonly string[],
): Promise<FeedRow<WireMark>[]> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return [];
  const rows = await db
    .selectFrom("annotations")
    .selectAll()
    .where("id", "in", unique)
    .where("user_id", "=", membership.user_id)
    .where("band_id", "=", membership.band_id)
    .execute();
  const byId = new Map(rows.map((r) => [r.id, r]));
  return unique.flatMap((id): FeedRow<WireMark>[] => {
    const r = byId.get(id);
    if (!r) return [];
    const mark = r.deleted_at ? null : toMark(r);
    return mark ? [{ id, op: "upsert", data: mark }] : [{ id, op: "delete" }];
  });
}

function outcome(mutationId: string, err: unknown): MutationResult {
  if (err instanceof AppError) {
    if (err.code === "conflict" && err.details && "current" in err.details) {
      return { mutationId, status: "conflict", current: (err.details.current ?? null) as WireSetlist | WireMark | null };
    }
    return { mutationId, status: "rejected", reason: err.message, ...(err.details?.fields ? { fields: err.details.fields } : {}) };
  }
  throw err;
}

function parsed<T>(schema: z.ZodType<T>, data: unknown): T {
  return parseInput(schema, data, { prefix: "data", fallback: "The set list is not valid." });
}

/** Applies one set-list mutation from a device. The caller has already resolved the membership. */
export async function pushSetlistMutation(db: Kysely<Database>, membership: Membership, m: Mutation, now = new Date()): Promise<MutationResult> {
  try {
    // Refused before the data is read, as the route refuses before it parses the body.
    assertMay(membership, "editSetlists");
    if (m.op === "delete") {
      await deleteSetlistAs(db, membership, { id: m.id, now });
      return { mutationId: m.mutationId, status: "applied", revision: m.baseRevision ?? 0, data: null };
    }
    const data = parsed(SetlistInputSchema, m.data);
    const base = m.op === "restore" || !m.baseRevision ? null : m.baseRevision;
    const saved = await saveSetlistAs(db, membership, { id: m.id, data, baseRevision: base, now });
    return { mutationId: m.mutationId, status: "applied", revision: saved.revision, data: saved };
  } catch (err) {
    return outcome(m.mutationId, err);
  }
}

const MarkPushSchema = z.object({ chartId: z.string().min(1).max(64), data: MarkDataSchema }).strict();

/** Applies one mark mutation from a device: only the owner's own marks. */
export async function pushMarkMutation(db: Kysely<Database>, membership: Membership, m: Mutation, now = new Date()): Promise<MutationResult> {
  try {
    if (m.op === "delete") {
      await deleteMarkAs(db, membership, { id: m.id, now });
      return { mutationId: m.mutationId, status: "applied", revision: m.baseRevision ?? 0, data: null };
    }
    const data = parsed(MarkPushSchema, m.data);
    const base = m.op === "restore" || !m.baseRevision ? null : m.baseRevision;
    const saved = await saveMarkAs(db, membership, { id: m.id, chartId: data.chartId, data: data.data, baseRevision: base, now });
    return { mutationId: m.mutationId, status: "applied", revision: saved.revision, data: saved };
  } catch (err) {
    return outcome(m.mutationId, err);
  }
}
