// A device that stored charts in the old shape opens the book after the update: version 2 rewrites them.
import Dexie from "dexie";
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { describe, expect, it } from "vitest";
import { LocalBook } from "@/lib/offline/db";

describe("the local book's version 2 upgrade", () => {
  it("turns concertKey/updatedByName chart rows (and outbox copies) into the wire chart's key and updatedBy", async () => {
    const name = `upgrade-${Math.random()}`;
    const old = new Dexie(name, { indexedDB, IDBKeyRange });
    old.version(1).stores({ charts: "id, bandId, conflictOf", outbox: "++seq, &mutationId, bandId, entityId, status" });
    const row = { id: "c1", bandId: "b1", title: "Quay Song", concertKey: "Eb", updatedBy: "u1", updatedByName: "Odile", revision: 3 };
    await old.table("charts").put(row);
    await old.table("outbox").add({ mutationId: "m-00000001", bandId: "b1", entityId: "c1", status: "pending", before: { ...row } });
    old.close();

    const book = new LocalBook(name, { indexedDB, IDBKeyRange });
    const chart = (await book.charts.get("c1")) as unknown as Record<string, unknown>;
    expect([chart.key, chart.updatedBy, chart.deletedAt, "concertKey" in chart, "updatedByName" in chart]).toEqual(["Eb", { id: "u1", name: "Odile" }, null, false, false]);
    const [item] = await book.outbox.toArray();
    expect(item?.before?.updatedBy).toEqual({ id: "u1", name: "Odile" });
    book.close();
  });
});
