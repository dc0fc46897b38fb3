"use client";
// When a page syncs: on load, on regaining signal, on returning to the tab, every few minutes
// while online, and when the service worker reports it sent the outbox in the background.
import type { SyncEngine } from "./sync";

export const SYNC_EVERY_MS = 3 * 60_000;

/** Wires the triggers in a page. Returns a function that removes them. */
export function startSyncTriggers(engine: SyncEngine): () => void {
  const onOnline = () => void engine.sync({ force: true });
  const onVisible = () => {
    if (document.visibilityState === "visible") void engine.sync({ force: false });
  };
  const onMessage = (e: MessageEvent) => {
    if ((e.data as { type?: string } | null)?.type === "pedalpoint-synced") void engine.sync({ force: false });
  };
  window.addEventListener("online", onOnline);
  document.addEventListener("visibilitychange", onVisible);
  navigator.serviceWorker?.addEventListener("message", onMessage);
  const timer = window.setInterval(() => {
    if (navigator.onLine) void engine.sync({ force: false });
  }, SYNC_EVERY_MS);
  void engine.sync({ force: true });
  return () => {
    window.removeEventListener("online", onOnline);
    document.removeEventListener("visibilitychange", onVisible);
    navigator.serviceWorker?.removeEventListener("message", onMessage);
    window.clearInterval(timer);
  };
}
