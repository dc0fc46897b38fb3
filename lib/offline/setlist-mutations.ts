"use client";
// Set-list and mark writes from the pages, on the same send() and outbox as chart writes (./send.ts).
// A set list goes to its route when the server answers; marks have no route of their own and
// always travel in the outbox, sent by a sync started at once.
import type { MarkData, SetlistEntry, SetlistInput } from "@/lib/setlist";
import type { WireSetlist } from "@/lib/wire";
import { putSetlist } from "./apply";
import { getLocalBook, type LocalBook } from "./db";
import { enqueue, newId } from "./outbox";
import { hasQueued, refusal, send, settle, type DeleteResult, type SaveResult } from "./send";
import { getSyncEngine, requestBackgroundSync } from "./sync";
import type { LocalMark, LocalSetlist } from "./types";

export type SetlistMeta = Pick<LocalSetlist, "name" | "startsAt" | "venue" | "notes" | "setMinutes">;

export interface SetlistSave {
  id: string;
  /** The revision the edit is based on; 0 for a set list not yet saved. */
  revision: number;
  meta: SetlistMeta;
  entries: readonly SetlistEntry[];
}

function toInput(s: SetlistMeta, entries: readonly SetlistEntry[]): SetlistInput {
  return {
    name: s.name,
    startsAt: s.startsAt,
    venue: s.venue,
    notes: s.notes,
    setMinutes: s.setMinutes ?? [],
    entries: entries.map((e) => ({
      id: e.id, chartId: e.chartId, setNumber: e.setNumber, position: e.position, key: e.key, tempo: e.tempo,
      intro: e.intro, ending: e.ending, soloOrder: e.soloOrder, choruses: e.choruses, straightIn: e.straightIn, notes: e.notes,
    })),
  };
}

async function stored(book: LocalBook, s: WireSetlist): Promise<WireSetlist> {
  await book.transaction("rw", book.setlists, book.setlistEntries, () => putSetlist(book, s.bandId, s));
  return s;
}

function sendSoon(bandId: string): void {
  void requestBackgroundSync();
  void getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
}

/** Saves the whole set list: through its route when the server answers (a refusal names the field at once), else queued. */
export async function saveSetlist(bandId: string, { id, revision, meta, entries }: SetlistSave): Promise<SaveResult<WireSetlist>> {
  const book = getLocalBook();
  const input = toInput(meta, entries);
  if (!(await hasQueued(book, id))) {
    const sent = revision === 0
      ? await send(bandId, "/setlists", { method: "POST", body: JSON.stringify({ id, ...input }) })
      : await send(bandId, `/setlists/${encodeURIComponent(id)}`, { method: "PUT", body: JSON.stringify({ baseRevision: revision, ...input }) });
    if (sent.kind === "answer") return settle<WireSetlist, WireSetlist>(sent.res, "setlist", (w) => stored(book, w), "The set list was not saved.");
  }
  const user = (await book.session.get("me"))?.userId ?? "";
  const row: WireSetlist = {
    id, bandId, ...input, revision, updatedAt: new Date().toISOString(), updatedBy: user,
    entries: input.entries.map((e) => ({ ...e, setlistId: id })),
  };
  await book.transaction("rw", book.setlists, book.setlistEntries, book.outbox, async () => {
    await putSetlist(book, bandId, row);
    await enqueue(book, { bandId, entity: "setlist", entityId: id, op: "upsert", baseRevision: revision || null, data: input, label: meta.name });
  });
  sendSoon(bandId);
  return { status: "queued", row };
}

async function dropSetlist(book: LocalBook, id: string): Promise<void> {
  await book.setlists.delete(id);
  await book.setlistEntries.where("setlistId").equals(id).delete();
}

export async function deleteSetlist(bandId: string, setlist: Pick<LocalSetlist, "id" | "revision" | "name">): Promise<DeleteResult<WireSetlist>> {
  const book = getLocalBook();
  const queuedBefore = await hasQueued(book, setlist.id);
  if (setlist.revision > 0 && !queuedBefore) {
    const sent = await send(bandId, `/setlists/${encodeURIComponent(setlist.id)}`, { method: "DELETE" });
    if (sent.kind === "answer") {
      if (!sent.res.ok) return refusal(await settle<WireSetlist, WireSetlist>(sent.res, "setlist", (w) => stored(book, w), "The set list was not deleted."));
      await book.transaction("rw", book.setlists, book.setlistEntries, () => dropSetlist(book, setlist.id));
      return { status: "saved" };
    }
  }
  await book.transaction("rw", book.setlists, book.setlistEntries, book.outbox, async () => {
    await dropSetlist(book, setlist.id);
    // Known to the server, or a queued create still to send: the delete follows it.
    if (setlist.revision > 0 || queuedBefore) {
      await enqueue(book, { bandId, entity: "setlist", entityId: setlist.id, op: "delete", baseRevision: setlist.revision || null, label: setlist.name });
    }
  });
  sendSoon(bandId);
  return { status: "queued" };
}

function markLabel(data: MarkData): string {
  return data.text || "highlight";
}

/** Saves this user's own mark locally and queues it; marks sync like everything else. */
export async function saveMark(bandId: string, mark: { id?: string; chartId: string; revision: number; data: MarkData }): Promise<SaveResult<LocalMark>> {
  const book = getLocalBook();
  const row: LocalMark = { id: mark.id ?? newId(), bandId, chartId: mark.chartId, revision: mark.revision, updatedAt: new Date().toISOString(), data: mark.data, localEdit: true };
  await book.transaction("rw", book.annotations, book.outbox, async () => {
    await book.annotations.put(row);
    await enqueue(book, {
      bandId, entity: "annotation", entityId: row.id, op: "upsert", baseRevision: mark.revision || null,
      data: { chartId: mark.chartId, data: mark.data }, label: markLabel(mark.data),
    });
  });
  sendSoon(bandId);
  return { status: "queued", row };
}

export async function deleteMark(bandId: string, mark: Pick<LocalMark, "id" | "revision" | "data">): Promise<DeleteResult<LocalMark>> {
  const book = getLocalBook();
  await book.transaction("rw", book.annotations, book.outbox, async () => {
    await book.annotations.delete(mark.id);
    await enqueue(book, { bandId, entity: "annotation", entityId: mark.id, op: "delete", baseRevision: mark.revision || null, label: markLabel(mark.data) });
  });
  sendSoon(bandId);
  return { status: "queued" };
}
