// Sending the outbox and acting on each answer. Nothing a player wrote is dropped: an applied edit
// becomes the stored row, a clash becomes a conflict copy beside the band's version, and a refused
// edit stays in the outbox with the server's reason.
import { putServerChart } from "./apply";
import type { LocalBook } from "./db";
import { deleteChartLocally } from "./db";
import { backOff, dueItems, markAttempted, newId, toMutation } from "./outbox";
import type { WireChart } from "@/lib/wire";
import type { MutationResult, PushResponse } from "./protocol";
import { AccessLostError, AuthError, NetworkError, ServerError, type Transport } from "./transport";
import type { ChartRow, OutboxItem } from "./types";

export const COPY_SUFFIX = " (my offline copy)";

async function laterItems(book: LocalBook, item: OutboxItem): Promise<OutboxItem[]> {
  return (await book.outbox.where("entityId").equals(item.entityId).toArray()).filter(
    (i) => i.entity === item.entity && i.status === "pending" && (i.seq ?? 0) > (item.seq ?? 0),
  );
}

async function onApplied(book: LocalBook, item: OutboxItem, r: Extract<MutationResult, { status: "applied" }>, me: string | null) {
  const later = await laterItems(book, item);
  await book.outbox.delete(item.seq!);
  for (const l of later) await book.outbox.update(l.seq!, { baseRevision: r.revision });
  // A mark's next edit builds on the revision the server just gave it.
  if (item.entity === "annotation" && item.op !== "delete" && later.length === 0) {
    await book.annotations.update(item.entityId, { revision: r.revision, localEdit: false });
  }
  if (item.entity !== "chart") return;
  if (item.op === "delete") {
    if (later.length === 0) await deleteChartLocally(book, item.entityId);
    return;
  }
  const data = r.data as WireChart | null | undefined;
  if (later.length === 0 && data) {
    await putServerChart(book, data, me);
    return;
  }
  // More local edits are queued behind this one: keep the local text, move the base forward.
  await book.charts.update(item.entityId, { revision: r.revision });
}

/** The device's version becomes a copy beside the band's; the band's version takes the row's place. */
async function onConflict(book: LocalBook, item: OutboxItem, r: Extract<MutationResult, { status: "conflict" }>, me: string | null) {
  const later = await laterItems(book, item);
  for (const i of [item, ...later]) await book.outbox.delete(i.seq!);
  const last = later[later.length - 1] ?? item;
  const copyId = newId();
  const current = r.current as (WireChart & { revision: number }) | null;
  if (item.entity === "chart") {
    const local = await book.charts.get(item.entityId);
    // A delete that clashed with someone's edit keeps no copy: their version comes back instead.
    if (local && last.op !== "delete") {
      const title = local.title.endsWith(COPY_SUFFIX) ? local.title : `${local.title}${COPY_SUFFIX}`;
      const copy: ChartRow = {
        ...local,
        id: copyId,
        title,
        // The page shows the chart's own title: say there too that this is the copy.
        body: { ...local.body, title },
        conflictOf: item.entityId,
        unseen: false,
        deleted: false,
        localEdit: false,
      };
      await book.charts.put(copy);
    }
    if (current) await putServerChart(book, current, me);
    else await deleteChartLocally(book, item.entityId);
  }
  await book.conflicts.put({
    id: copyId,
    bandId: item.bandId,
    entity: item.entity,
    entityId: item.entityId,
    mutation: { ...toMutation(last), baseRevision: item.baseRevision },
    serverRevision: current?.revision ?? null,
    createdAt: new Date().toISOString(),
  });
}

async function onRejected(book: LocalBook, item: OutboxItem, r: Extract<MutationResult, { status: "rejected" }>) {
  await book.outbox.update(item.seq!, { status: "rejected", reason: r.reason, ...(r.fields ? { fields: r.fields } : {}) });
  if (item.entity !== "chart") return;
  const later = await laterItems(book, item);
  if (later.length > 0) return;
  // Show the band's version again; the refused text stays in the outbox item for the user to see.
  if (item.before) await book.charts.put(item.before);
  else if (!item.baseRevision) await book.charts.delete(item.entityId);
  else await book.charts.update(item.entityId, { deleted: false, localEdit: false });
}

export interface PushSummary {
  sent: number;
  applied: number;
  conflicts: number;
  rejected: number;
}

/** Sends the band's due outbox items in rounds (one item per row per round) until none are left. */
export async function pushOutbox(book: LocalBook, transport: Transport, bandId: string, me: string | null, opts: { force?: boolean; now?: () => Date } = {}): Promise<PushSummary> {
  const now = opts.now ?? (() => new Date());
  const sum: PushSummary = { sent: 0, applied: 0, conflicts: 0, rejected: 0 };
  for (let round = 0; round < 50; round++) {
    const batch = await dueItems(book, bandId, { now: now(), force: opts.force });
    if (batch.length === 0) break;
    await markAttempted(book, batch);
    let res: Response;
    try {
      res = await transport.fetch(`/api/bands/${encodeURIComponent(bandId)}/sync`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ mutations: batch.map(toMutation) }),
      });
    } catch (err) {
      await backOff(book, batch, now());
      throw new NetworkError(err);
    }
    if (res.status === 401) throw new AuthError();
    if (res.status === 403 || res.status === 404) throw new AccessLostError(bandId);
    if (!res.ok) {
      await backOff(book, batch, now());
      throw new ServerError(res.status);
    }
    const { results } = (await res.json()) as PushResponse;
    sum.sent += batch.length;
    const bySeq = new Map(results.map((r) => [r.mutationId, r]));
    for (const item of batch) {
      const r = bySeq.get(item.mutationId);
      if (!r) continue;
      await book.transaction("rw", [book.outbox, book.charts, book.revisions, book.conflicts, book.annotations, book.attachments, book.attachmentFiles], async () => {
        const still = await book.outbox.get(item.seq!);
        if (!still || still.mutationId !== item.mutationId) return; // answered already (another tab)
        if (r.status === "applied") {
          sum.applied++;
          await onApplied(book, still, r, me);
        } else if (r.status === "conflict") {
          sum.conflicts++;
          await onConflict(book, still, r, me);
        } else {
          sum.rejected++;
          await onRejected(book, still, r);
        }
      });
    }
  }
  return sum;
}
