"use client";
// Set lists and marks as the screens read them: live queries on the local book, so a gig opens the
// same with and without signal. Writes go to the server when it answers, else into the book and the
// outbox for the next sync.
import { useLiveQuery } from "dexie-react-hooks";
import type { Chart } from "@/lib/chart/model";
import { getLocalBook } from "@/lib/offline/db";
import { enqueue, newId } from "@/lib/offline/outbox";
import type { WireSetlist } from "@/lib/wire";
import { getSyncEngine } from "@/lib/offline/sync";
import type { LocalMark, LocalChart, LocalMembership, LocalSetlist, LocalSetlistEntry } from "@/lib/offline/types";
import { readMark, type MarkData, type SetlistEntry, type SetlistInput } from "@/lib/setlist";
import { can } from "@/lib/band/roles";

export interface LoadedSetlist {
  setlist: LocalSetlist;
  entries: LocalSetlistEntry[];
}

export function useSetlists(bandId: string | null): LocalSetlist[] | undefined {
  return useLiveQuery(async () => {
    if (!bandId) return [];
    const rows = await getLocalBook().setlists.where("bandId").equals(bandId).toArray();
    return rows.sort((a, b) => (b.startsAt ?? "").localeCompare(a.startsAt ?? "") || a.name.localeCompare(b.name));
  }, [bandId]);
}

export function useSetlistEntryCounts(bandId: string | null): Map<string, number> | undefined {
  return useLiveQuery(async () => {
    const counts = new Map<string, number>();
    if (!bandId) return counts;
    for (const e of await getLocalBook().setlistEntries.where("bandId").equals(bandId).toArray()) {
      counts.set(e.setlistId, (counts.get(e.setlistId) ?? 0) + 1);
    }
    return counts;
  }, [bandId]);
}

/** undefined while opening; null when this device does not hold it. */
export function useSetlist(setlistId: string | null): LoadedSetlist | null | undefined {
  return useLiveQuery(async () => {
    if (!setlistId) return null;
    const book = getLocalBook();
    const setlist = await book.setlists.get(setlistId);
    if (!setlist) return null;
    const entries = await book.setlistEntries.where("setlistId").equals(setlistId).toArray();
    entries.sort((a, b) => a.setNumber - b.setNumber || a.position - b.position);
    return { setlist, entries };
  }, [setlistId]);
}

export function useBookCharts(bandId: string | null): LocalChart[] | undefined {
  return useLiveQuery(async () => {
    if (!bandId) return [];
    const rows = await getLocalBook().charts.where("bandId").equals(bandId).toArray();
    return rows.filter((c) => !c.conflictOf && !("deleted" in c && c.deleted)).sort((a, b) => a.title.localeCompare(b.title));
  }, [bandId]);
}

export function useMyMembership(bandId: string | null): LocalMembership | null | undefined {
  return useLiveQuery(async () => (bandId ? ((await getLocalBook().memberships.get(bandId)) ?? null) : null), [bandId]);
}

/** True once this device has finished a sync of the band (so a missing row is really missing). */
export function useHasSynced(bandId: string | null): boolean | undefined {
  return useLiveQuery(async () => (bandId ? Boolean((await getLocalBook().syncState.get(bandId))?.lastSyncedAt) : false), [bandId]);
}

export function useMe(): string | null | undefined {
  return useLiveQuery(async () => (await getLocalBook().session.get("me"))?.userId ?? null, []);
}

/** This user's marks on the given charts (marks only ever reach their owner's devices). */
export function useMyMarks(chartIds: readonly string[]): LocalMark[] | undefined {
  const key = chartIds.join(",");
  return useLiveQuery(async () => {
    if (chartIds.length === 0) return [];
    const rows = await getLocalBook().annotations.where("chartId").anyOf([...chartIds]).toArray();
    // A mark written by a newer version of the app may not read here: it is left out, not shown wrong.
    return rows.flatMap((r) => {
      const data = readMark(r.data);
      return data ? [{ ...r, data }] : [];
    });
  }, [key]);
}

export function chartBody(c: LocalChart | undefined): Chart | null {
  return c?.body ?? null;
}

export function canEditSetlists(m: LocalMembership | null | undefined): boolean {
  return can(m?.role, "editSetlists");
}

export type SetlistMeta = Pick<LocalSetlist, "name" | "startsAt" | "venue" | "notes" | "setMinutes">;

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

export async function storeSetlist(w: WireSetlist): Promise<void> {
  const book = getLocalBook();
  await book.transaction("rw", book.setlists, book.setlistEntries, async () => {
    const { entries, ...list } = w;
    await book.setlists.put({ ...list });
    await book.setlistEntries.where("setlistId").equals(w.id).delete();
    await book.setlistEntries.bulkPut(entries.map((e) => ({ ...e, setlistId: w.id, bandId: w.bandId })));
  });
}

export type SaveOutcome =
  | { status: "saved"; setlist: WireSetlist }
  | { status: "queued" }
  | { status: "conflict"; message: string }
  | { status: "invalid"; message: string; fields: { field: string; message: string }[] };

interface ErrorBody {
  error?: { code?: string; message?: string; fields?: { field: string; message: string }[]; current?: WireSetlist };
}

/**
 * Saves the whole set list. `revision` 0 = new. Online: through the route, so a refusal names the field
 * at once. With no signal: into the book and the outbox.
 */
export async function saveSetlist(
  bandId: string,
  id: string,
  revision: number,
  meta: SetlistMeta,
  entries: readonly SetlistEntry[],
): Promise<SaveOutcome> {
  const input = toInput(meta, entries);
  const base = `/api/bands/${encodeURIComponent(bandId)}/setlists`;
  let res: Response | null = null;
  try {
    res = await fetch(revision === 0 ? base : `${base}/${encodeURIComponent(id)}`, {
      method: revision === 0 ? "POST" : "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(revision === 0 ? { id, ...input } : { baseRevision: revision, ...input }),
    });
  } catch {
    res = null;
  }
  if (res && res.ok) {
    const { setlist } = (await res.json()) as { setlist: WireSetlist };
    await storeSetlist(setlist);
    return { status: "saved", setlist };
  }
  if (res && res.status < 500) {
    const body = (await res.json().catch(() => ({}))) as ErrorBody;
    if (res.status === 409 && body.error?.current) {
      await storeSetlist(body.error.current);
      return { status: "conflict", message: body.error.message ?? "Someone else changed this set list." };
    }
    return { status: "invalid", message: body.error?.message ?? "The set list was not saved.", fields: body.error?.fields ?? [] };
  }
  const now = new Date().toISOString();
  await storeSetlist({
    id, bandId, ...input, revision, updatedAt: now, updatedBy: "",
    entries: input.entries.map((e) => ({ ...e, setlistId: id })),
  });
  await enqueue(getLocalBook(), { bandId, entity: "setlist", entityId: id, op: "upsert", baseRevision: revision || null, data: input, label: meta.name });
  void getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
  return { status: "queued" };
}

export async function deleteSetlistEverywhere(bandId: string, id: string, revision: number, name: string): Promise<void> {
  const book = getLocalBook();
  await book.transaction("rw", book.setlists, book.setlistEntries, async () => {
    await book.setlists.delete(id);
    await book.setlistEntries.where("setlistId").equals(id).delete();
  });
  await enqueue(book, { bandId, entity: "setlist", entityId: id, op: "delete", baseRevision: revision || null, label: name });
  void getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
}

/** Saves this user's own mark locally and queues it; marks sync like everything else. */
export async function saveMark(bandId: string, mark: { id?: string; chartId: string; revision: number; data: MarkData }): Promise<void> {
  const book = getLocalBook();
  const id = mark.id ?? newId();
  await book.annotations.put({ id, bandId, chartId: mark.chartId, revision: mark.revision, updatedAt: new Date().toISOString(), data: mark.data, localEdit: true });
  await enqueue(book, {
    bandId, entity: "annotation", entityId: id, op: "upsert", baseRevision: mark.revision || null,
    data: { chartId: mark.chartId, data: mark.data }, label: mark.data.text || "highlight",
  });
  void getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
}

export async function deleteMarkEverywhere(bandId: string, mark: { id: string; revision: number; data: MarkData }): Promise<void> {
  const book = getLocalBook();
  await book.annotations.delete(mark.id);
  await enqueue(book, { bandId, entity: "annotation", entityId: mark.id, op: "delete", baseRevision: mark.revision || null, label: mark.data.text || "highlight" });
  void getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
}

export { newId };
