"use client";
// The status control in the band bar: signal or not, when the book last came in, unsent changes,
// and a way to sync now. Opening it shows the details: progress, problems, copies, book size.
import { useEffect, useId, useRef, useState } from "react";
import { syncNow, useConflicts, useEngineState, useRejected, useSyncStatus } from "@/lib/offline/hooks";
import { getSyncEngine } from "@/lib/offline/sync";
import { SyncDetails } from "./SyncDetails";

const STATE_WORDS = { online: "In sync", offline: "No signal", syncing: "Syncing", error: "Sync problem" } as const;

export function ago(iso: string | null, now = Date.now()): string {
  if (!iso) return "not yet";
  const s = Math.max(0, Math.round((now - new Date(iso).getTime()) / 1000));
  if (s < 45) return "just now";
  const m = Math.round(s / 60);
  if (m < 60) return `${m} min ago`;
  const h = Math.round(m / 60);
  if (h < 24) return `${h} h ago`;
  return new Date(iso).toLocaleDateString(undefined, { day: "numeric", month: "short" });
}

function Dot({ state }: { state: keyof typeof STATE_WORDS }) {
  const colour = state === "online" ? "bg-emerald-400" : state === "syncing" ? "bg-brass-light animate-pulse" : state === "error" ? "bg-red-400" : "bg-paper/40";
  return <span aria-hidden className={`inline-block h-2.5 w-2.5 shrink-0 rounded-full ${colour} ${state === "offline" ? "ring-1 ring-paper/70" : ""}`} />;
}

export function SyncStatus() {
  const status = useSyncStatus();
  const engine = useEngineState();
  const conflicts = useConflicts();
  const rejected = useRejected();
  const [open, setOpen] = useState(false);
  const [, tick] = useState(0);
  const panelId = useId();
  const boxRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const t = window.setInterval(() => tick((n) => n + 1), 30_000);
    return () => window.clearInterval(t);
  }, []);

  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") setOpen(false);
    };
    const onClick = (e: MouseEvent) => {
      if (boxRef.current && !boxRef.current.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener("keydown", onKey);
    document.addEventListener("mousedown", onClick);
    return () => {
      document.removeEventListener("keydown", onKey);
      document.removeEventListener("mousedown", onClick);
    };
  }, [open]);

  const problems = (conflicts?.length ?? 0) + (rejected?.length ?? 0) + engine.notices.length;
  const progress = status.progress;
  const summary =
    status.state === "syncing" && progress
      ? `Syncing: ${progress.received} of ${progress.total} received`
      : status.state === "offline"
        ? `No signal — reading this device's copy. Last synced ${ago(status.lastSyncedAt)}`
        : status.state === "error"
          ? (status.error ?? "Sync problem")
          : `Synced ${ago(status.lastSyncedAt)}`;

  return (
    <div ref={boxRef} className="relative" data-testid="sync-status" data-state={status.state} data-pending={status.pending} data-problems={problems}>
      <div className="flex items-center gap-1">
        <button
          type="button"
          aria-expanded={open}
          aria-controls={panelId}
          onClick={() => setOpen((o) => !o)}
          className="flex min-h-11 items-center gap-2 rounded-md px-2 text-sm text-paper hover:bg-ink-soft focus-visible:outline focus-visible:outline-2 focus-visible:outline-brass-light"
          data-testid="sync-status-toggle"
        >
          <Dot state={status.state} />
          <span className="font-semibold">{STATE_WORDS[status.state]}</span>
          <span className="hidden text-paper/75 sm:inline" data-testid="sync-last">
            {status.state === "syncing" && progress ? `${progress.received}/${progress.total}` : ago(status.lastSyncedAt)}
          </span>
          {status.pending > 0 ? (
            <span className="rounded-full bg-brass-light px-2 text-xs font-bold text-ink" data-testid="sync-pending">
              {status.pending} unsent
            </span>
          ) : null}
          {problems > 0 ? (
            <span className="rounded-full bg-red-200 px-2 text-xs font-bold text-red-950" data-testid="sync-problems">
              {problems} to check
            </span>
          ) : null}
        </button>
        <button
          type="button"
          onClick={() => void syncNow()}
          disabled={status.state === "syncing"}
          className="min-h-11 rounded-md px-2 text-sm font-semibold text-brass-light underline-offset-4 hover:underline disabled:opacity-50"
          data-testid="sync-now"
        >
          Sync now
        </button>
      </div>
      <p className="sr-only" role="status" aria-live="polite">
        {summary}
        {status.pending > 0 ? `. ${status.pending} change${status.pending === 1 ? "" : "s"} not sent yet` : ""}
      </p>
      {progress && status.state === "syncing" ? (
        <div className="absolute inset-x-0 -bottom-1 h-1 overflow-hidden rounded bg-ink-soft" aria-hidden>
          <div className="h-full bg-brass-light transition-all" style={{ width: `${Math.round((progress.received / Math.max(1, progress.total)) * 100)}%` }} />
        </div>
      ) : null}
      {open ? (
        <div id={panelId} className="absolute right-0 z-50 mt-2 w-[min(24rem,calc(100vw-1rem))] rounded-md border border-ink-soft bg-paper p-4 text-ink shadow-xl">
          <SyncDetails summary={summary} onDismissNotice={(i) => getSyncEngine().dismissNotice(i)} />
        </div>
      ) : null}
    </div>
  );
}
