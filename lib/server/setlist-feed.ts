import "server-only";
// What the sync feed needs from set lists and marks: loaders that turn changed ids into wire rows
// (filtered by what the caller may see) and push handlers for the device's outbox.
import type { Kysely } from "kysely";
import type { Database, Membership } from "@/db/schema";
import type { Mutation, MutationResult, WireAnnotation, WireSetlist } from "@/lib/offline/protocol";
import { MarkDataSchema, SetlistInputSchema } from "@/lib/setlist";
import { z } from "zod";
import { deleteMarkUnchecked, saveMarkUnchecked, toMark } from "./annotations";
import { AppError } from "./errors";
import { deleteSetlistUnchecked, loadSetlists, saveSetlistUnchecked } from "./setlists";
import { sharedSetlistIds } from "./shares";
import { zodIssues } from "./zod-issues";
import { can, describePermission } from "@/lib/band/roles";

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
export async function loadAnnotationFeedRows(
  db: Kysely<Database>,
  membership: Membership,
  ids: readonly string[],
): Promise<FeedRow<WireAnnotation>[]> {
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
  return unique.flatMap((id): FeedRow<WireAnnotation>[] => {
    const r = byId.get(id);
    if (!r) return [];
    const mark = r.deleted_at ? null : toMark(r);
    return mark ? [{ id, op: "upsert", data: mark }] : [{ id, op: "delete" }];
  });
}

function outcome(mutationId: string, err: unknown): MutationResult {
  if (err instanceof AppError) {
    if (err.code === "conflict" && err.details && "current" in err.details) {
      return { mutationId, status: "conflict", current: (err.details.current ?? null) as WireSetlist | WireAnnotation | null };
    }
    return { mutationId, status: "rejected", reason: err.message, ...(err.details?.fields ? { fields: err.details.fields } : {}) };
  }
  throw err;
}

function parsed<T>(schema: z.ZodType<T>, data: unknown): T {
  const r = schema.safeParse(data);
  if (r.success) return r.data;
  const fields = zodIssues(r.error).map((f) => ({ ...f, field: `data.${f.field}` }));
  throw new AppError("unprocessable", fields[0]?.message ?? "The set list is not valid.", { fields });
}

/** Applies one set-list mutation from a device. The caller has already resolved the membership. */
export async function pushSetlistMutation(db: Kysely<Database>, membership: Membership, m: Mutation, now = new Date()): Promise<MutationResult> {
  try {
    if (!can(membership.role, "editSetlists")) throw new AppError("forbidden", `This needs ${describePermission("editSetlists")}; you are a ${membership.role} in this band.`);
    if (m.op === "delete") {
      await deleteSetlistUnchecked(db, membership.user_id, membership.band_id, m.id, now);
      return { mutationId: m.mutationId, status: "applied", revision: m.baseRevision ?? 0, data: null };
    }
    const data = parsed(SetlistInputSchema, m.data);
    const base = m.op === "restore" || !m.baseRevision ? null : m.baseRevision;
    const saved = await saveSetlistUnchecked(db, membership.user_id, membership.band_id, m.id, data, base, now);
    return { mutationId: m.mutationId, status: "applied", revision: saved.revision, data: saved };
  } catch (err) {
    return outcome(m.mutationId, err);
  }
}

const AnnotationPushSchema = z.object({ chartId: z.string().min(1).max(64), data: MarkDataSchema }).strict();

/** Applies one mark mutation from a device: only the owner's own marks. */
export async function pushAnnotationMutation(db: Kysely<Database>, membership: Membership, m: Mutation, now = new Date()): Promise<MutationResult> {
  try {
    if (m.op === "delete") {
      await deleteMarkUnchecked(db, membership, m.id, now);
      return { mutationId: m.mutationId, status: "applied", revision: m.baseRevision ?? 0, data: null };
    }
    const data = parsed(AnnotationPushSchema, m.data);
    const base = m.op === "restore" || !m.baseRevision ? null : m.baseRevision;
    const saved = await saveMarkUnchecked(db, membership, m.id, data.chartId, data.data, base, now);
    return { mutationId: m.mutationId, status: "applied", revision: saved.revision, data: saved };
  } catch (err) {
    return outcome(m.mutationId, err);
  }
}
