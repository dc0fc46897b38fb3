"use client";
// The opened status control: what is waiting, what went wrong and what to do, and the book's size.
import Link from "next/link";
import { useEffect, useState } from "react";
import { discardCopy, publishCopy, saveCopyAsNewChart } from "@/lib/offline/conflicts";
import { getLocalBook } from "@/lib/offline/db";
import { useBandCharts, useConflicts, useEngineState, useMyBands, useRejected, useSyncStatus } from "@/lib/offline/hooks";
import { dismissRejected } from "@/lib/offline/outbox";
import { storageEstimate } from "@/lib/offline/sync";
import type { ConflictRow } from "@/lib/offline/types";
import { can } from "@/lib/band/roles";

function size(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024))} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

function BookSize() {
  const [est, setEst] = useState<Awaited<ReturnType<typeof storageEstimate>>>(null);
  useEffect(() => {
    void storageEstimate().then(setEst).catch(() => setEst(null));
  }, []);
  if (!est) return null;
  return (
    <p className="text-sm text-ink-muted" data-testid="sync-storage">
      On this device: {size(est.usage)}
      {est.quota ? ` of ${size(est.quota)} allowed` : ""}. {est.persisted ? "Kept even when the device is short of space." : "The browser may clear it when the device is short of space."}
    </p>
  );
}

function ConflictItem({ c, canEdit }: { c: ConflictRow; canEdit: boolean }) {
  const charts = useBandCharts(c.bandId);
  const copy = charts?.find((x) => x.id === c.id);
  const [msg, setMsg] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function act(fn: () => Promise<unknown>, done: string) {
    setBusy(true);
    try {
      await fn();
      setMsg(done);
    } catch {
      setMsg("That did not work. Try again.");
    } finally {
      setBusy(false);
    }
  }
  const label = copy?.title ?? (typeof (c.mutation.data as { title?: unknown } | undefined)?.title === "string" ? String((c.mutation.data as { title: string }).title) : "A chart");
  return (
    <li className="rounded border border-ink/15 p-2" data-testid="sync-conflict">
      <p className="text-sm">
        <strong>{label}</strong>: someone published a newer version
        {c.serverRevision ? ` (revision ${c.serverRevision})` : ""} while this device was editing it. Both are kept.
      </p>
      <div className="mt-1 flex flex-wrap gap-x-3 text-sm font-semibold">
        {copy ? (
          <Link className="underline" href={`/bands/${encodeURIComponent(c.bandId)}/charts/${encodeURIComponent(c.id)}`}>
            Open my copy
          </Link>
        ) : null}
        {copy && canEdit ? (
          <>
            <button type="button" disabled={busy} className="underline" onClick={() => act(() => publishCopy(c.id), "Your version is published.")}>
              Publish mine
            </button>
            <button type="button" disabled={busy} className="underline" onClick={() => act(() => saveCopyAsNewChart(c.id), "Saved as a chart of its own.")}>
              Keep as a new chart
            </button>
          </>
        ) : null}
        <button type="button" disabled={busy} className="underline" onClick={() => act(() => discardCopy(c.id), "Your copy was removed.")}>
          {copy ? "Keep the band's version" : "Dismiss"}
        </button>
      </div>
      {msg ? <p className="text-sm text-ink-muted">{msg}</p> : null}
    </li>
  );
}

export function SyncDetails({ summary, onDismissNotice }: { summary: string; onDismissNotice: (i: number) => void }) {
  const status = useSyncStatus();
  const engine = useEngineState();
  const conflicts = useConflicts() ?? [];
  const rejected = useRejected() ?? [];
  const bands = useMyBands() ?? [];
  const canEdit = (bandId: string) => {
    return can(bands.find((b) => b.id === bandId)?.role, "editCharts");
  };

  return (
    <div className="space-y-3" data-testid="sync-details">
      <p className="font-semibold">{summary}</p>
      {status.progress ? (
        <div>
          <progress className="w-full" max={status.progress.total} value={status.progress.received} aria-label="Charts received" />
          <p className="text-sm">
            {status.progress.received} of {status.progress.total} received
          </p>
        </div>
      ) : null}
      <p className="text-sm">
        {status.pending === 0 ? "Every change made here has been sent." : `${status.pending} change${status.pending === 1 ? "" : "s"} made here will be sent when there is signal.`}
      </p>
      {engine.problem === "auth" ? (
        <p className="text-sm">
          <Link className="font-semibold underline" href={`/signin?callbackUrl=${encodeURIComponent(typeof window === "undefined" ? "/bands" : window.location.pathname)}`}>
            Sign in again
          </Link>{" "}
          to send and receive changes. Nothing on this device is lost.
        </p>
      ) : null}
      {engine.notices.map((n, i) => (
        <p key={i} className="rounded bg-brass-light/60 p-2 text-sm" role="alert">
          {n}{" "}
          <button type="button" className="font-semibold underline" onClick={() => onDismissNotice(i)}>
            OK
          </button>
        </p>
      ))}
      {rejected.length > 0 ? (
        <section aria-label="Changes the server refused">
          <h3 className="text-sm font-bold">Not saved</h3>
          <ul className="mt-1 space-y-2">
            {rejected.map((r) => (
              <li key={r.seq} className="rounded border border-red-800/30 p-2 text-sm" data-testid="sync-rejected">
                <strong>{r.label}</strong>: {r.reason ?? "The server refused this change."}
                {typeof (r.data as { sourceText?: unknown } | undefined)?.sourceText === "string" ? (
                  <details className="mt-1">
                    <summary className="cursor-pointer">Your text</summary>
                    <pre className="mt-1 max-h-40 overflow-auto whitespace-pre-wrap text-xs">{(r.data as { sourceText: string }).sourceText}</pre>
                  </details>
                ) : null}
                <button type="button" className="mt-1 font-semibold underline" onClick={() => void dismissRejected(getLocalBook(), r.seq!)}>
                  Dismiss
                </button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {conflicts.length > 0 ? (
        <section aria-label="Conflict copies">
          <h3 className="text-sm font-bold">Edited in two places</h3>
          <ul className="mt-1 space-y-2">
            {conflicts.map((c) => (
              <ConflictItem key={c.id} c={c} canEdit={canEdit(c.bandId)} />
            ))}
          </ul>
        </section>
      ) : null}
      <BookSize />
    </div>
  );
}
