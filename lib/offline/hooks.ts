"use client";
// What the pages read: live queries on the local book (undefined while loading), the same with or
// without signal. Pages never fetch band data from the server themselves.
import { useLiveQuery } from "dexie-react-hooks";
import { useSyncExternalStore } from "react";
import { getLocalBook } from "./db";
import { clearDevice, getSyncEngine, type EngineState } from "./sync";
import { readMark } from "@/lib/setlist";
import type {
  ChartRow, ConflictRow, LocalBand, LocalChart, LocalMark, LocalMember, LocalMembership, LocalRevision, LocalSession, LocalSetlist,
  LocalSetlistEntry, OutboxItem, SyncStatus,
} from "./types";

export type { LocalBand, LocalChart, LocalMember, LocalMembership, LocalRevision, LocalSession, SyncStatus } from "./types";

function toChart(r: ChartRow): LocalChart {
  const chart: LocalChart & Partial<ChartRow> = { ...r };
  delete chart.seenRevision;
  delete chart.deleted;
  delete chart.localEdit;
  return chart;
}

const byTitle = (a: { title: string }, b: { title: string }) => a.title.localeCompare(b.title, undefined, { sensitivity: "base", numeric: true });

/** The last session this device saw; kept so that losing signal never sends a player to sign in. */
export function useLocalSession(): LocalSession | null | undefined {
  return useLiveQuery(async () => {
    const s = await getLocalBook().session.get("me");
    return s ? { userId: s.userId, email: s.email, name: s.name } : null;
  }, []);
}

export function useMyBands(): LocalBand[] | undefined {
  return useLiveQuery(async () => (await getLocalBook().bands.toArray()).sort((a, b) => a.name.localeCompare(b.name)), []);
}

export function useMembership(bandId: string | null | undefined): LocalMembership | null | undefined {
  return useLiveQuery(async () => (bandId ? ((await getLocalBook().memberships.get(bandId)) ?? null) : null), [bandId]);
}

/**
 * The band's charts on this device, by title. Conflict copies sit beside the chart they belong to,
 * unless `copies` is false (a set list picks from the book itself).
 */
export function useBandCharts(bandId: string | null | undefined, { copies = true }: { copies?: boolean } = {}): LocalChart[] | undefined {
  return useLiveQuery(async () => {
    if (!bandId) return [];
    const rows = await getLocalBook().charts.where("bandId").equals(bandId).toArray();
    return rows.filter((r) => !r.deleted && (copies || !r.conflictOf)).sort(byTitle).map(toChart);
  }, [bandId, copies]);
}

export function useChart(bandId: string | null | undefined, chartId: string | null | undefined): LocalChart | null | undefined {
  return useLiveQuery(async () => {
    if (!bandId || !chartId) return null;
    const r = await getLocalBook().charts.get(chartId);
    return r && r.bandId === bandId && !r.deleted ? toChart(r) : null;
  }, [bandId, chartId]);
}

/** The history list, newest first. */
export function useChartRevisions(chartId: string | null | undefined): LocalRevision[] | undefined {
  return useLiveQuery(async () => {
    if (!chartId) return [];
    const list = await getLocalBook().revisions.where("chartId").equals(chartId).toArray();
    return list.sort((a, b) => b.revision - a.revision);
  }, [chartId]);
}

/** The roster (the server sends it to leaders). */
export function useMembers(bandId: string | null | undefined): LocalMember[] | undefined {
  return useLiveQuery(async () => {
    if (!bandId) return [];
    const list = await getLocalBook().members.where("bandId").equals(bandId).toArray();
    return list.sort((a, b) => a.name.localeCompare(b.name));
  }, [bandId]);
}

/** The band's set lists, latest gig first. */
export function useSetlists(bandId: string | null): LocalSetlist[] | undefined {
  return useLiveQuery(async () => {
    if (!bandId) return [];
    const rows = await getLocalBook().setlists.where("bandId").equals(bandId).toArray();
    return rows.sort((a, b) => (b.startsAt ?? "").localeCompare(a.startsAt ?? "") || a.name.localeCompare(b.name));
  }, [bandId]);
}

/** How many tunes each of the band's set lists holds. */
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

export interface LoadedSetlist {
  setlist: LocalSetlist;
  entries: LocalSetlistEntry[];
}

/** One set list with its entries in play order; undefined while opening, null when this device does not hold it. */
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

/** True once this device has finished a sync of the band (so a missing row is really missing). */
export function useHasSynced(bandId: string | null): boolean | undefined {
  return useLiveQuery(async () => (bandId ? Boolean((await getLocalBook().syncState.get(bandId))?.lastSyncedAt) : false), [bandId]);
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

/** Conflict copies on this device (one band or all). */
export function useConflicts(bandId?: string | null): ConflictRow[] | undefined {
  return useLiveQuery(async () => {
    const t = getLocalBook().conflicts;
    const list = bandId ? await t.where("bandId").equals(bandId).toArray() : await t.toArray();
    return list.sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  }, [bandId]);
}

/** Edits the server refused, with its reason, until the user dismisses them. */
export function useRejected(bandId?: string | null): OutboxItem[] | undefined {
  return useLiveQuery(async () => {
    const all = await getLocalBook().outbox.where("status").equals("rejected").toArray();
    return all.filter((i) => !bandId || i.bandId === bandId);
  }, [bandId]);
}

const engineSubscribe = (fn: () => void) => getSyncEngine().subscribe(fn);
const engineSnapshot = (): EngineState => getSyncEngine().getSnapshot();
const serverEngine: EngineState = { running: false, notices: [] };

export function useEngineState(): EngineState {
  return useSyncExternalStore(engineSubscribe, engineSnapshot, () => serverEngine);
}

function onlineSubscribe(fn: () => void) {
  window.addEventListener("online", fn);
  window.addEventListener("offline", fn);
  return () => {
    window.removeEventListener("online", fn);
    window.removeEventListener("offline", fn);
  };
}

export function useOnline(): boolean {
  return useSyncExternalStore(onlineSubscribe, () => navigator.onLine, () => true);
}

export function useSyncStatus(): SyncStatus {
  const engine = useEngineState();
  const online = useOnline();
  const local = useLiveQuery(async () => {
    const book = getLocalBook();
    const pending = await book.outbox.where("status").equals("pending").count();
    const states = await book.syncState.toArray();
    const lastSyncedAt = states.reduce<string | null>((m, s) => (s.lastSyncedAt && (!m || s.lastSyncedAt > m) ? s.lastSyncedAt : m), null);
    return { pending, lastSyncedAt };
  }, []);
  const state: SyncStatus["state"] = !online || engine.problem === "network" ? "offline" : engine.running ? "syncing" : engine.problem ? "error" : "online";
  return {
    state,
    lastSyncedAt: local?.lastSyncedAt ?? null,
    pending: local?.pending ?? 0,
    ...(engine.progress ? { progress: engine.progress } : {}),
    ...(engine.error && engine.problem !== "network" ? { error: engine.error } : {}),
  };
}

/** Opening a chart clears its "updated since you last opened it" mark. */
export async function markChartSeen(chartId: string): Promise<void> {
  const book = getLocalBook();
  await book.transaction("rw", book.charts, async () => {
    const r = await book.charts.get(chartId);
    // readFrom keeps the revision read before this one, for the "what changed" summary (components/changes).
    if (r && (r.unseen || r.seenRevision < r.revision)) await book.charts.update(chartId, { unseen: false, seenRevision: r.revision, readFrom: r.seenRevision });
  });
}

export function syncNow(bandId?: string): Promise<void> {
  return getSyncEngine().sync({ bandId, force: true });
}

/** Removes this user's data from the device, then ends the session. */
export async function signOutAndClear(): Promise<void> {
  await clearDevice(getLocalBook());
  const { signOut } = await import("next-auth/react");
  await signOut({ callbackUrl: "/signin" });
}
