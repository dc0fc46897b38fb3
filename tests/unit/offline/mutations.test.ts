// saveChart as the pages call it: online answers land in the local book; no answer queues the
// edit; a bad chart text is refused on the device, before any request.
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { LocalBook, setLocalBook } from "@/lib/offline/db";
import { saveChart } from "@/lib/offline/mutations";
import { SIMPLE_CHART, chartInput } from "../server/helpers";

let book: LocalBook;
const C1 = "0b6f7c1e-5d0a-4b7e-9a53-2f1c8d9e4a10";
const input = () => ({ ...chartInput({ title: "Quay Song" }), message: "" });
const dto = (over: Record<string, unknown> = {}) => ({
  id: C1, bandId: "b1", title: "Quay Song", composer: "", key: "C", meter: "4/4", tempo: 120, feel: "swing", sourceText: SIMPLE_CHART,
  body: { title: "Quay Song", composer: "", key: "C", meter: { beats: 4, unit: 4 }, tempo: 120, feel: "swing", intro: null, sections: [{ label: "A", bars: [] }] },
  revision: 1, updatedBy: { id: "u1", name: "Odile" }, updatedAt: "2026-12-01T22:00:00.000Z", deletedAt: null, ...over,
});
// The save itself answers as given; the background sync it starts finds no session.
const respond = (status: number, body: unknown) =>
  vi.fn(async (url: string) =>
    url.startsWith("/api/me/") ? new Response("{}", { status: 401 }) : new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } }),
  );

beforeEach(async () => {
  book = new LocalBook(`mut-${Math.random()}`, { indexedDB, IDBKeyRange });
  setLocalBook(book);
  await book.session.put({ key: "me", userId: "u1", email: "odile@example.test", name: "Odile", seenAt: "" });
});
afterEach(() => {
  vi.unstubAllGlobals();
  setLocalBook(null);
});

describe("saveChart", () => {
  it("online: posts the chart and stores the server's answer", async () => {
    const fetch = respond(201, { chart: dto() });
    vi.stubGlobal("fetch", fetch);
    const r = await saveChart("b1", { ...input(), id: C1 });
    expect(r.status).toBe("saved");
    expect(fetch.mock.calls[0]?.[0]).toBe("/api/bands/b1/charts");
    expect((await book.charts.get(C1))?.revision).toBe(1);
    expect(await book.outbox.count()).toBe(0);
  });

  it("online: a 409 answers with the server's current version, stored locally, and nothing queued", async () => {
    vi.stubGlobal("fetch", respond(409, { error: { code: "conflict", message: "Odile published revision 3", current: dto({ revision: 3, feel: "ballad" }) } }));
    const r = await saveChart("b1", { ...input(), id: C1, baseRevision: 2 });
    expect(r.status).toBe("conflict");
    expect(r.status === "conflict" ? [r.current.revision, r.current.feel, r.message] : null).toEqual([3, "ballad", "Odile published revision 3"]);
    expect(await book.outbox.count()).toBe(0);
  });

  it("online: a 422 comes back as field problems with line and column", async () => {
    const fields = [{ field: "sourceText", message: "Unknown chord", line: 6, column: 3 }];
    vi.stubGlobal("fetch", respond(422, { error: { code: "unprocessable", message: "Line 6", fields } }));
    const r = await saveChart("b1", { ...input(), id: C1, baseRevision: 1 });
    expect(r.status === "invalid" ? r.fields : null).toEqual(fields);
  });

  it("no answer: writes the edit locally and queues it", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Promise.reject(new TypeError("Failed to fetch"))));
    const r = await saveChart("b1", { ...input(), feel: "latin", id: C1, baseRevision: 4 });
    expect(r.status).toBe("queued");
    const [item] = await book.outbox.toArray();
    expect([item?.entityId, item?.baseRevision, (item?.data as { feel: string }).feel]).toEqual([C1, 4, "latin"]);
    expect((await book.charts.get(C1))?.feel).toBe("latin");
  });

  it("refuses a chart text that does not read, on the device, without a request", async () => {
    const fetch = vi.fn();
    vi.stubGlobal("fetch", fetch);
    const r = await saveChart("b1", { ...input(), sourceText: "title: X\nkey: C\ntime: 4/4\n\nA:\n| Cmaj7 | Qx9!! |\n" });
    expect(r.status).toBe("invalid");
    expect(r.status === "invalid" ? r.fields[0]?.line : null).toBe(6);
    expect(fetch).not.toHaveBeenCalled();
  });

  it("queues behind an edit already waiting, so the two reach the server in order", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Promise.reject(new TypeError("Failed to fetch"))));
    await saveChart("b1", { ...input(), feel: "first", id: C1, baseRevision: 1 });
    const fetch = respond(200, { chart: dto() });
    vi.stubGlobal("fetch", fetch);
    const r = await saveChart("b1", { ...input(), feel: "second", id: C1, baseRevision: 1 });
    expect(r.status).toBe("queued");
    expect(fetch).not.toHaveBeenCalled();
  });
});
