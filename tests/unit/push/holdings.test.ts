// What a device reports it holds after a pull: tonight's set lists, their charts' revisions and the
// parts whose files are stored here, and nothing about gigs long past.
import { randomUUID } from "node:crypto";
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { describe, expect, it } from "vitest";
import { LocalBook } from "@/lib/offline/db";
import { holdingsOf } from "@/lib/offline/readiness-report";
import type { ChartRow } from "@/lib/offline/types";

const NOW = new Date("2026-12-04T18:00:00Z");

function chart(id: string, revision: number): ChartRow {
  return {
    id, bandId: "b", title: id, composer: "", key: "C", meter: "4/4", tempo: null, feel: "",
    body: { title: id, composer: "", key: "C", meter: { beats: 4, unit: 4 }, tempo: null, feel: "", intro: null, sections: [{ label: "A", bars: [] }] },
    sourceText: "", revision, updatedAt: "", updatedBy: { id: "", name: "" }, deletedAt: null, unseen: false, seenRevision: revision,
  };
}

const list = (id: string, startsAt: string | null, revision = 1) => ({ id, bandId: "b", name: id, startsAt, venue: "", notes: "", revision, updatedAt: "", updatedBy: "" });
const entry = (setlistId: string, chartId: string) => ({ id: randomUUID(), setlistId, bandId: "b", setNumber: 1, position: 0, chartId, key: null, intro: null, ending: null, tempo: null, soloOrder: "", notes: "" });

describe("device holdings report", () => {
  it("lists tonight's set list, its charts at the revision held and the parts stored, not last month's gig", async () => {
    const book = new LocalBook(`holdings-${randomUUID()}`, { indexedDB, IDBKeyRange });
    await book.charts.bulkPut([chart("tonight-tune", 4), chart("old-tune", 2)]);
    await book.setlists.bulkPut([list("tonight", "2026-12-04T20:30:00Z", 3), list("last-month", "2026-11-01T20:30:00Z")]);
    await book.setlistEntries.bulkPut([entry("tonight", "tonight-tune"), entry("last-month", "old-tune")]);
    await book.attachments.bulkPut([
      { id: "p-held", bandId: "b", chartId: "tonight-tune", filename: "horn.pdf", sha256: "abc", size: 1, type: "application/pdf", pages: 1, createdAt: "" },
      { id: "p-missing", bandId: "b", chartId: "tonight-tune", filename: "bass.pdf", sha256: "def", size: 1, type: "application/pdf", pages: 1, createdAt: "" },
    ]);
    await book.attachmentFiles.put({ id: "p-held", blob: new Blob(["x"]), storedAt: "" });
    await book.syncState.put({ bandId: "b", cursor: 42, scope: "player", lastSyncedAt: null });
    expect(await holdingsOf(book, "b", NOW)).toEqual({ cursor: 42, setlists: { tonight: 3 }, charts: { "tonight-tune": 4 }, parts: { "p-held": "abc" } });
  });
});
