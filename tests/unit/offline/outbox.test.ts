// The outbox queue on its own: coalescing unsent edits, queuing behind a sent one, backoff.
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { describe, expect, it } from "vitest";
import { LocalBook } from "@/lib/offline/db";
import { backOff, dueItems, enqueue, markAttempted } from "@/lib/offline/outbox";

const book = () => new LocalBook(`outbox-${Math.random()}`, { indexedDB, IDBKeyRange });
const edit = (entityId: string, feel: string, op: "upsert" | "delete" = "upsert", baseRevision: number | null = 3) => ({
  bandId: "b1", entity: "chart", entityId, op, baseRevision, data: { feel }, label: "Tune",
});

describe("the outbox", () => {
  it("folds a second edit of a row into the first while neither was sent, keeping the first base", async () => {
    const b = book();
    await enqueue(b, edit("c1", "one"));
    await enqueue(b, edit("c1", "two", "upsert", 9));
    const items = await b.outbox.toArray();
    expect(items.map((i) => [i.baseRevision, (i.data as { feel: string }).feel])).toEqual([[3, "two"]]);
  });

  it("queues behind an edit that may have reached the server, and sends one per row at a time", async () => {
    const b = book();
    const first = await enqueue(b, edit("c1", "one"));
    await markAttempted(b, [first]);
    await enqueue(b, edit("c1", "two"));
    await enqueue(b, edit("c2", "other"));
    expect(await b.outbox.count()).toBe(3);
    const due = await dueItems(b, "b1", { now: new Date() });
    expect(due.map((i) => [i.entityId, (i.data as { feel: string }).feel])).toEqual([["c1", "one"], ["c2", "other"]]);
  });

  it("forgets a chart made and deleted before it was ever sent", async () => {
    const b = book();
    await enqueue(b, edit("c3", "new", "upsert", null));
    await enqueue(b, edit("c3", "", "delete", null));
    expect(await b.outbox.count()).toBe(0);
  });

  it("waits longer after each failure, unless asked to send now", async () => {
    const b = book();
    const item = await enqueue(b, edit("c4", "x"));
    const now = new Date("2026-12-01T22:00:00Z");
    await backOff(b, [item], now);
    expect(await dueItems(b, "b1", { now })).toEqual([]);
    expect(await dueItems(b, "b1", { now: new Date(now.getTime() + 2_500) })).toHaveLength(1);
    expect(await dueItems(b, "b1", { now, force: true })).toHaveLength(1);
    const [again] = await b.outbox.toArray();
    await backOff(b, [again!], now);
    const [later] = await b.outbox.toArray();
    expect(new Date(later!.nextAttemptAt!).getTime() - now.getTime()).toBe(4_000);
  });
});
