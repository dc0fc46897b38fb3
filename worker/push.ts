/// <reference lib="webworker" />
// Push in the service worker: a message says a band's book changed; the worker runs the same delta
// pull the pages use, works out in words what changed on this device, and shows one notification per
// band (a burst folds into the one showing). A push it cannot read means "sync every band here".
// Tapping the notification opens the changed chart, tonight's set list or the library.
import { describeChanges } from "../lib/chart/changes";
import type { Chart } from "../lib/chart/model";
import { getLocalBook, type LocalBook } from "../lib/offline/db";
import { getSyncEngine } from "../lib/offline/sync";
import { readPushMessage, type PushMessage } from "../lib/push/message";
import { composeNotice, noticeTag, type ChangedTune, type NoticeData } from "../lib/push/notice";
import { endingInWords, introInWords, type EndingChoice } from "../lib/setlist";

declare const self: ServiceWorkerGlobalScope;

interface Held {
  charts: Map<string, { revision: number; title: string; body: Chart }>;
  entries: Map<string, { key: string | null; intro: string; ending: string; chartId: string; setlistId: string }>;
}

async function snapshot(book: LocalBook, bandId: string): Promise<Held> {
  const charts = new Map<string, Held["charts"] extends Map<string, infer V> ? V : never>();
  for (const c of await book.charts.where("bandId").equals(bandId).toArray()) if (!c.conflictOf) charts.set(c.id, { revision: c.revision, title: c.title, body: c.body });
  const entries: Held["entries"] = new Map();
  for (const e of await book.setlistEntries.where("bandId").equals(bandId).toArray()) {
    entries.set(e.id, { key: e.key, intro: introInWords(e.intro), ending: endingInWords((e.ending ?? null) as EndingChoice | null), chartId: e.chartId, setlistId: e.setlistId });
  }
  return { charts, entries };
}

/** The earliest gig still to come (or started in the last 12 hours) with one of these charts on it. */
async function tonight(book: LocalBook, bandId: string, chartIds: Set<string>, hint: string | null): Promise<{ id: string; name: string } | null> {
  const soon = Date.now() - 12 * 3600_000;
  const lists = (await book.setlists.where("bandId").equals(bandId).toArray())
    .filter((s) => !s.startsAt || Date.parse(s.startsAt) >= soon)
    .sort((a, b) => (a.startsAt ?? "9999").localeCompare(b.startsAt ?? "9999"));
  for (const s of lists) {
    if (s.id === hint) return { id: s.id, name: s.name };
    const entries = await book.setlistEntries.where("setlistId").equals(s.id).toArray();
    if (entries.some((e) => chartIds.has(e.chartId))) return { id: s.id, name: s.name };
  }
  return null;
}

function changedTunes(before: Held, after: Held, instrument: string): ChangedTune[] {
  const out = new Map<string, ChangedTune>();
  for (const [id, now] of after.charts) {
    const was = before.charts.get(id);
    if (!was || was.revision >= now.revision) continue;
    out.set(id, { chartId: id, title: now.title, lines: describeChanges(was.body, now.body, { instrument }) });
  }
  // Tonight's choices on a set list (key, intro, ending) count as a change to that tune.
  for (const [id, e] of after.entries) {
    const was = before.entries.get(id);
    if (!was || (was.key === e.key && was.intro === e.intro && was.ending === e.ending)) continue;
    const chart = after.charts.get(e.chartId);
    if (!chart) continue;
    const lines = describeChanges(chart.body, chart.body, { instrument, tonight: { before: was, after: e } });
    const known = out.get(e.chartId);
    out.set(e.chartId, { chartId: e.chartId, title: chart.title, lines: [...(known?.lines ?? []), ...lines] });
  }
  return [...out.values()];
}

async function notify(book: LocalBook, bandId: string, before: Held, msg: PushMessage | null): Promise<void> {
  const band = await book.bands.get(bandId);
  if (!band) return;
  const after = await snapshot(book, bandId);
  const changed = changedTunes(before, after, band.instrument);
  if (changed.length === 0 && msg?.kind !== "nudge") return;
  const showing = await self.registration.getNotifications({ tag: noticeTag(bandId) });
  const previous = (showing[0]?.data as NoticeData | undefined) ?? null;
  const setlist = await tonight(book, bandId, new Set(changed.map((c) => c.chartId)), msg?.setlistId ?? null);
  const n = composeNotice({ bandId, bandName: band.name, setlist, changed, previous, nudge: msg?.kind === "nudge" });
  await self.registration.showNotification(n.title, { body: n.body, tag: n.tag, data: n.data, icon: "/icons/icon-192.png", badge: "/icons/icon-192.png" });
}

async function onPush(msg: PushMessage | null): Promise<void> {
  const book = getLocalBook();
  const bandIds = msg ? [msg.bandId] : (await book.bands.toArray()).map((b) => b.id);
  const before = new Map<string, Held>();
  for (const id of bandIds) before.set(id, await snapshot(book, id));
  await getSyncEngine().sync({ bandId: msg?.bandId, force: true });
  for (const client of await self.clients.matchAll({ type: "window" })) client.postMessage({ type: "pedalpoint-synced" });
  for (const id of bandIds) {
    try {
      await notify(book, id, before.get(id)!, msg);
    } catch (err) {
      // No permission to show notifications: the book is synced all the same.
      console.warn("pedalpoint: could not show a notification", err);
    }
  }
}

async function openFromNotice(data: NoticeData | undefined): Promise<void> {
  const url = new URL(data?.url ?? "/bands", self.location.origin).href;
  const windows = await self.clients.matchAll({ type: "window", includeUncontrolled: true });
  const open = windows.find((w) => w.url === url) ?? windows[0];
  if (open) {
    await open.focus();
    if (open.url !== url) await open.navigate(url);
    return;
  }
  await self.clients.openWindow(url);
}

export function registerPushHandlers(): void {
  self.addEventListener("push", (event) => {
    let text: string | null = null;
    try {
      text = event.data?.text() ?? null;
    } catch {
      text = null;
    }
    event.waitUntil(onPush(readPushMessage(text)));
  });
  self.addEventListener("notificationclick", (event) => {
    event.notification.close();
    event.waitUntil(openFromNotice(event.notification.data as NoticeData | undefined));
  });
}
