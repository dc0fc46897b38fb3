import "server-only";
// The push side of sync: a device's queued edits, applied one by one through the same use cases the
// pages call (same validation, roles, revisions and feed rows). Each mutation id is answered once;
// a re-send gets the first answer back.
import type { Kysely } from "kysely";
import type { Database, Membership } from "@/db/schema";
import type { Mutation, MutationResult, PushResponse } from "@/lib/offline/protocol";
import type { WireChart } from "@/lib/wire";
import { requireMember, type Actor, signedIn } from "./access";
import { createChart, deleteChart, restoreRevision, updateChart } from "./charts";
import { AppError } from "./errors";
import { pushMarkMutation, pushSetlistMutation } from "./setlist-feed";
import { loadCharts } from "./sync-rows";
import { IdSchema } from "@/lib/validation/common";

export interface PushContext {
  db: Kysely<Database>;
  actor: Actor;
  membership: Membership;
  bandId: string;
  mutation: Mutation;
}

/** One handler per kind of row a device may change. A new kind adds one line to MUTATION_HANDLERS. */
export type MutationHandler = (ctx: PushContext) => Promise<MutationResult>;

async function currentChart(db: Kysely<Database>, bandId: string, id: string): Promise<WireChart | null> {
  const got = (await loadCharts(db, bandId, [id])).get(id);
  return got ? (JSON.parse(got.json) as WireChart) : null;
}

const SAME_FIELDS = [
  ["title", "title"], ["composer", "composer"], ["concert_key", "key"], ["meter", "meter"],
  ["tempo", "tempo"], ["feel", "feel"], ["source_text", "sourceText"],
] as const;

/** The stored revision when the chart already says what this edit says (a re-send whose first answer was lost). */
async function alreadySays(db: Kysely<Database>, bandId: string, id: string, input: Record<string, unknown>): Promise<number | null> {
  const row = await db.selectFrom("charts").selectAll().where("id", "=", id).where("band_id", "=", bandId).executeTakeFirst();
  if (!row || row.deleted_at) return null;
  for (const [column, field] of SAME_FIELDS) {
    const raw = input[field] ?? (field === "tempo" ? null : "");
    const want = typeof raw === "string" && field !== "sourceText" ? raw.trim() : raw;
    if (want !== row[column]) return null;
  }
  return row.revision;
}

async function applyChart({ db, actor, bandId, mutation: m }: PushContext): Promise<number> {
  if (m.op === "delete") {
    // A device deletes what it has seen: without a base revision the delete could wipe an edit it
    // never saw, so it is a conflict (revision 0 never matches a stored chart).
    return (await deleteChart(db, actor, bandId, m.id, { baseRevision: m.baseRevision ?? 0 })).revision;
  }
  if (m.op === "restore") {
    const revision = (m.data as { revision?: unknown } | undefined)?.revision;
    if (typeof revision !== "number") throw new AppError("unprocessable", "Which revision to restore is missing.", { fields: [{ field: "data.revision", message: "Required" }] });
    return (await restoreRevision(db, actor, bandId, m.id, revision)).revision;
  }
  const input = (m.data && typeof m.data === "object" ? m.data : {}) as Record<string, unknown>;
  try {
    if (!m.baseRevision) return (await createChart(db, actor, bandId, { ...input, id: m.id })).revision;
    return (await updateChart(db, actor, bandId, m.id, { ...input, baseRevision: m.baseRevision })).revision;
  } catch (err) {
    if (err instanceof AppError && err.code === "conflict") {
      const same = await alreadySays(db, bandId, m.id, input);
      if (same !== null) return same;
    }
    throw err;
  }
}

const pushChart: MutationHandler = async (ctx) => {
  const { db, bandId, mutation: m } = ctx;
  try {
    const revision = await applyChart(ctx);
    const data = m.op === "delete" ? null : await currentChart(db, bandId, m.id);
    return { mutationId: m.mutationId, status: "applied", revision, data };
  } catch (err) {
    if (!(err instanceof AppError) || err.code === "unauthenticated") throw err;
    if (err.code === "conflict") return { mutationId: m.mutationId, status: "conflict", current: await currentChart(db, bandId, m.id) };
    return { mutationId: m.mutationId, status: "rejected", reason: err.message, ...(err.details?.fields ? { fields: err.details.fields } : {}) };
  }
};

// A map with no prototype, read only through Object.hasOwn: an entity named "constructor",
// "__proto__" or "valueOf" finds nothing instead of a built-in function.
export const MUTATION_HANDLERS: Readonly<Record<string, MutationHandler>> = Object.freeze(
  Object.assign(Object.create(null) as Record<string, MutationHandler>, {
    chart: pushChart,
    setlist: ({ db, membership, mutation }: PushContext) => pushSetlistMutation(db, membership, mutation),
    annotation: ({ db, membership, mutation }: PushContext) => pushMarkMutation(db, membership, mutation),
  }),
);

function handlerFor(entity: string): MutationHandler | undefined {
  return Object.hasOwn(MUTATION_HANDLERS, entity) ? MUTATION_HANDLERS[entity] : undefined;
}

/** The same id rule as the REST routes, for the row id and the change id. */
function badId(m: Mutation): string | null {
  if (!IdSchema.safeParse(m.id).success) return "id";
  if (!IdSchema.safeParse(m.mutationId).success) return "mutationId";
  return null;
}

/** Lets other requests run between two mutations, so one long push never holds the server. */
const yieldToOthers = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function pushMutations(db: Kysely<Database>, actor: Actor | null, bandId: string, mutations: Mutation[]): Promise<PushResponse> {
  const membership = await requireMember(db, actor, bandId, "belong");
  const me = signedIn(actor);
  const results: MutationResult[] = [];
  for (const m of mutations) {
    await yieldToOthers();
    const wrongId = badId(m);
    if (wrongId) {
      // Not stored: a change id that breaks the rule is not a key worth keeping.
      results.push({ mutationId: m.mutationId, status: "rejected", reason: "Not a valid id: use letters, digits, - and _ only.", fields: [{ field: wrongId, message: "Not a valid id" }] });
      continue;
    }
    const prior = await db.selectFrom("applied_mutations").selectAll().where("id", "=", m.mutationId).executeTakeFirst();
    if (prior) {
      results.push(
        prior.user_id === me.userId && prior.band_id === bandId
          ? (JSON.parse(prior.result_json) as MutationResult)
          : { mutationId: m.mutationId, status: "rejected", reason: "That change id was already used." },
      );
      continue;
    }
    const handler = handlerFor(m.entity);
    const result: MutationResult = handler
      ? await handler({ db, actor: me, membership, bandId, mutation: m })
      : { mutationId: m.mutationId, status: "rejected", reason: `This server does not take changes to “${m.entity}”.` };
    // The stored answer leaves the row out (the next pull brings it). A duplicate racing this one
    // may have answered first: then its answer is the one returned.
    const kept = JSON.stringify(result.status === "applied" ? { ...result, data: undefined } : result);
    await db
      .insertInto("applied_mutations")
      .values({ id: m.mutationId, band_id: bandId, user_id: me.userId, result_json: kept, created_at: new Date().toISOString() })
      .onConflict((oc) => oc.column("id").doNothing())
      .execute();
    const stored = await db.selectFrom("applied_mutations").select("result_json").where("id", "=", m.mutationId).executeTakeFirst();
    results.push(stored && stored.result_json !== kept ? (JSON.parse(stored.result_json) as MutationResult) : result);
  }
  return { results };
}
