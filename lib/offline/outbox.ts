// The outbox: edits made on this device that the server has not answered yet. Rows survive restarts
// (IndexedDB); an item leaves only when the server applied it or kept it as a conflict, and a refused
// item stays, with the reason, until the user dismisses it.
import type { LocalBook } from "./db";
import type { Mutation } from "./protocol";
import type { ChartRow, OutboxItem } from "./types";

export function newId(): string {
  return globalThis.crypto.randomUUID();
}

export interface Enqueue {
  bandId: string;
  entity: string;
  entityId: string;
  op: OutboxItem["op"];
  baseRevision: number | null;
  data?: unknown;
  label: string;
  before?: ChartRow | null;
}

/**
 * Queues an edit. An edit of a row whose previous edit was never sent replaces it (one request,
 * same base); once a request may have reached the server, a new edit queues behind it and is
 * rebased when the first one's answer arrives.
 */
export async function enqueue(book: LocalBook, e: Enqueue, now = new Date()): Promise<OutboxItem> {
  return book.transaction("rw", book.outbox, async () => {
    const same = (await book.outbox.where("entityId").equals(e.entityId).toArray())
      .filter((i) => i.status === "pending" && i.entity === e.entity)
      .sort((a, b) => (a.seq ?? 0) - (b.seq ?? 0));
    const last = same[same.length - 1];
    if (last && last.attempts === 0) {
      if (e.op === "delete" && last.op === "upsert" && !last.baseRevision && same.length === 1) {
        // Made and deleted before the server ever heard of it.
        await book.outbox.delete(last.seq!);
        return { ...last, op: "delete" as const };
      }
      const merged: OutboxItem = { ...last, op: e.op, data: e.data, label: e.label, mutationId: newId(), createdAt: now.toISOString() };
      await book.outbox.put(merged);
      return merged;
    }
    const item: OutboxItem = {
      mutationId: newId(),
      bandId: e.bandId,
      entity: e.entity,
      entityId: e.entityId,
      op: e.op,
      baseRevision: last ? last.baseRevision : e.baseRevision,
      data: e.data,
      label: e.label,
      status: "pending",
      attempts: 0,
      nextAttemptAt: null,
      createdAt: now.toISOString(),
      before: last ? (last.before ?? null) : (e.before ?? null),
    };
    const seq = await book.outbox.add(item);
    return { ...item, seq };
  });
}

export function toMutation(i: OutboxItem): Mutation {
  return { mutationId: i.mutationId, entity: i.entity, id: i.entityId, op: i.op, baseRevision: i.baseRevision, data: i.data };
}

export interface DueOptions {
  now: Date;
  /** Ignore the backoff (the user pressed "sync now"). */
  force?: boolean;
  max?: number;
}

/** Items to send now, oldest first, at most one per row (a later edit waits for the earlier answer). */
export async function dueItems(book: LocalBook, bandId: string, { now, force = false, max = 100 }: DueOptions): Promise<OutboxItem[]> {
  const all = (await book.outbox.where("bandId").equals(bandId).toArray())
    .filter((i) => i.status === "pending")
    .sort((a, b) => (a.seq ?? 0) - (b.seq ?? 0));
  const seen = new Set<string>();
  const out: OutboxItem[] = [];
  for (const i of all) {
    const key = `${i.entity}:${i.entityId}`;
    if (seen.has(key)) continue;
    seen.add(key);
    if (!force && i.nextAttemptAt && i.nextAttemptAt > now.toISOString()) continue;
    out.push(i);
    if (out.length >= max) break;
  }
  return out;
}

/** After a failed send: wait longer each time (2 s, 4 s … up to 5 minutes). */
export async function backOff(book: LocalBook, items: OutboxItem[], now: Date): Promise<void> {
  await book.transaction("rw", book.outbox, async () => {
    for (const i of items) {
      const attempts = i.attempts + 1;
      const wait = Math.min(2 ** attempts * 1000, 5 * 60_000);
      await book.outbox.update(i.seq!, { attempts, nextAttemptAt: new Date(now.getTime() + wait).toISOString() });
    }
  });
}

/** Marks items as sent at least once (their request may have reached the server). */
export async function markAttempted(book: LocalBook, items: OutboxItem[]): Promise<void> {
  await book.transaction("rw", book.outbox, async () => {
    for (const i of items) if (i.attempts === 0) await book.outbox.update(i.seq!, { attempts: 1 });
  });
}

/** The user read the reason a change was refused and lets it go. */
export async function dismissRejected(book: LocalBook, seq: number): Promise<void> {
  const item = await book.outbox.get(seq);
  if (item?.status === "rejected") await book.outbox.delete(seq);
}
