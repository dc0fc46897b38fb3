// A full disk: the page of the feed that did not fit is rolled back whole, the cursor stays, the
// user gets a clear message, and the next sync (with room again) completes the book.
import { randomUUID } from "node:crypto";
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { afterAll, describe, expect, it, vi } from "vitest";
import { LocalBook } from "@/lib/offline/db";
import { SyncEngine } from "@/lib/offline/sync";
import { QUOTA_MESSAGE } from "@/lib/offline/transport";
import { createChart } from "@/lib/server/charts";
import { chartInput, cleanupDbs, freshDb, makeBand } from "../server/helpers";
import { fakeNetwork } from "./fake-server";

afterAll(() => cleanupDbs());

describe("running out of storage", () => {
  it("keeps the book as it was, says so plainly, and finishes later", async () => {
    const db = await freshDb();
    const cast = await makeBand(db);
    for (let i = 0; i < 3; i++) await createChart(db, cast.leader, cast.bandId, chartInput({ title: `Full ${i}` }));
    const book = new LocalBook(`quota-${randomUUID()}`, { indexedDB, IDBKeyRange });
    const engine = new SyncEngine({ book: () => book, transport: fakeNetwork(db, () => cast.player) });
    const originalBulkPut = book.charts.bulkPut.bind(book.charts);
    const spy = vi.spyOn(book.charts, "bulkPut").mockImplementation(() => {
      throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
    });
    await engine.sync();
    expect(engine.getSnapshot()).toMatchObject({ problem: "quota", error: QUOTA_MESSAGE });
    expect(await book.charts.count()).toBe(0);
    expect(await book.revisions.count()).toBe(0);
    expect((await book.syncState.get(cast.bandId))?.cursor ?? 0).toBe(0);
    spy.mockImplementation(originalBulkPut);
    await engine.sync();
    expect(engine.getSnapshot().problem).toBeUndefined();
    expect(await book.charts.count()).toBe(3);
    await db.destroy();
  });
});
