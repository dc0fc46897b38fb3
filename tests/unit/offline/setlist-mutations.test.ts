// Set-list and mark writes as the pages call them: the same send() and outbox as chart writes.
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { LocalBook, setLocalBook } from "@/lib/offline/db";
import { deleteSetlist, saveMark, saveSetlist } from "@/lib/offline/setlist-mutations";
import type { WireSetlist } from "@/lib/wire";

let book: LocalBook;
const S1 = "5d1e2f3a-4b5c-4d6e-8f70-8192a3b4c5d6";
const E1 = "6e2f3a4b-5c6d-4e7f-8081-92a3b4c5d6e7";
const C1 = "0b6f7c1e-5d0a-4b7e-9a53-2f1c8d9e4a10";
const meta = { name: "Harbour night", startsAt: null, venue: "The Lamp Room", notes: "", setMinutes: [] };
const entry = { id: E1, chartId: C1, setNumber: 1, position: 0, key: null, tempo: null, intro: null, ending: { kind: "cold" as const }, soloOrder: "", choruses: 1, straightIn: false, notes: "" };
const wire = (over: Partial<WireSetlist> = {}): WireSetlist => ({
  id: S1, bandId: "b1", ...meta, revision: 2, updatedBy: "u1", updatedAt: "2026-12-01T22:00:00.000Z", entries: [{ ...entry, setlistId: S1 }], ...over,
});
const calls = (f: ReturnType<typeof vi.fn>) => f.mock.calls.map((c) => String(c[0])).filter((u) => u.includes("/setlists"));
// The route answers as given; the sync a queued edit starts finds no session.
const respond = (status: number, body: unknown) =>
  vi.fn(async (url: string) =>
    url.includes("/setlists") ? new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } }) : new Response("{}", { status: 401 }),
  );
const unreachable = () => vi.fn(async () => Promise.reject(new TypeError("Failed to fetch")));

beforeEach(async () => {
  book = new LocalBook(`setl-${Math.random()}`, { indexedDB, IDBKeyRange });
  setLocalBook(book);
  await book.session.put({ key: "me", userId: "u1", email: "odile@example.test", name: "Odile", seenAt: "" });
});
afterEach(() => {
  vi.unstubAllGlobals();
  setLocalBook(null);
});

describe("saveSetlist", () => {
  it("online: puts the set list and stores the server's answer, entry ending typed as sent", async () => {
    const fetch = respond(200, { setlist: wire() });
    vi.stubGlobal("fetch", fetch);
    const r = await saveSetlist("b1", { id: S1, revision: 1, meta, entries: [entry] });
    expect(r.status).toBe("saved");
    expect(calls(fetch)).toEqual([`/api/bands/b1/setlists/${S1}`]);
    expect((await book.setlists.get(S1))?.revision).toBe(2);
    expect((await book.setlistEntries.get(E1))?.ending).toEqual({ kind: "cold" });
    expect(await book.outbox.count()).toBe(0);
  });

  it("a 401 is treated as no answer, as for charts: the edit is kept and queued", async () => {
    vi.stubGlobal("fetch", respond(401, { error: { code: "unauthenticated", message: "Sign in" } }));
    const r = await saveSetlist("b1", { id: S1, revision: 1, meta, entries: [entry] });
    expect(r.status).toBe("queued");
    expect((await book.outbox.toArray()).map((i) => [i.entity, i.entityId, i.baseRevision])).toEqual([["setlist", S1, 1]]);
  });

  it("a 409 stores the server's current version and names it a conflict", async () => {
    vi.stubGlobal("fetch", respond(409, { error: { code: "conflict", message: "Changed meanwhile", current: wire({ revision: 5, name: "Their name" }) } }));
    const r = await saveSetlist("b1", { id: S1, revision: 1, meta, entries: [entry] });
    expect(r.status === "conflict" ? [r.current.revision, r.message] : null).toEqual([5, "Changed meanwhile"]);
    expect((await book.setlists.get(S1))?.name).toBe("Their name");
  });

  it("queues behind an edit already waiting instead of sending past it", async () => {
    vi.stubGlobal("fetch", unreachable());
    await saveSetlist("b1", { id: S1, revision: 1, meta, entries: [entry] });
    const fetch = respond(200, { setlist: wire() });
    vi.stubGlobal("fetch", fetch);
    const r = await saveSetlist("b1", { id: S1, revision: 1, meta: { ...meta, name: "Second" }, entries: [entry] });
    expect(r.status).toBe("queued");
    expect(calls(fetch).filter((u) => !u.includes("/sync"))).toEqual([]);
    expect((await book.setlists.get(S1))?.name).toBe("Second");
  });
});

describe("deleteSetlist and saveMark", () => {
  it("a refused delete keeps the set list and reports why", async () => {
    await book.setlists.put({ ...wire(), entries: undefined } as never);
    vi.stubGlobal("fetch", respond(403, { error: { code: "forbidden", message: "Only a leader or an arranger can delete set lists." } }));
    const r = await deleteSetlist("b1", { id: S1, revision: 2, name: meta.name });
    expect(r.status === "invalid" ? r.message : null).toMatch(/leader or an arranger/);
    expect(await book.setlists.get(S1)).toBeDefined();
  });

  it("a mark is stored and queued in the one outbox", async () => {
    vi.stubGlobal("fetch", unreachable());
    const data = { anchor: { section: 0, sectionLabel: "A", occurrence: 0, bar: 1, chords: ["Dm7"] }, kind: "text" as const, text: "breathe", chartRevision: 1, lost: false };
    const r = await saveMark("b1", { chartId: C1, revision: 0, data });
    expect(r.status).toBe("queued");
    const [item] = await book.outbox.toArray();
    expect([item?.entity, item?.entityId, item?.label]).toEqual(["annotation", r.status === "queued" ? r.row.id : "", "breathe"]);
  });
});
