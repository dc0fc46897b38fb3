"use client";
// Who changed a chart, what and when; leaders and arrangers can put an older revision back
// (which publishes it again as a new revision, so nothing is lost).
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { formatDateTime } from "@/components/ui/labels";
import { useChart, useChartRevisions, useMembership } from "@/lib/offline/hooks";
import { restoreRevision } from "@/lib/offline/mutations";
import { describeChange } from "./revision-diff";
import { can } from "@/lib/band/roles";

type Outcome = { kind: "success" | "error" | "info"; text: string } | null;

export function ChartHistory({ bandId, chartId }: { bandId: string; chartId: string }) {
  const revisions = useChartRevisions(chartId);
  const chart = useChart(bandId, chartId);
  const membership = useMembership(bandId);
  const canRestore = can(membership?.role, "editCharts");
  const [asking, setAsking] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>(null);

  const newestFirst = [...(revisions ?? [])].sort((a, b) => b.revision - a.revision);
  const current = chart?.revision ?? newestFirst[0]?.revision ?? 0;

  async function restore(revision: number) {
    setBusy(true);
    setOutcome(null);
    try {
      const r = await restoreRevision(bandId, chartId, revision);
      if (r.status === "saved") setOutcome({ kind: "success", text: `Version ${revision} is the current chart again.` });
      else if (r.status === "queued") setOutcome({ kind: "info", text: `Version ${revision} will be restored when this device is back online.` });
      else if (r.status === "conflict") setOutcome({ kind: "error", text: "The chart changed meanwhile. Look at the newest version, then try again." });
      else setOutcome({ kind: "error", text: r.message ?? "That version could not be restored." });
    } catch (err) {
      console.error(err);
      setOutcome({ kind: "error", text: "That version could not be restored. Try again." });
    } finally {
      setBusy(false);
      setAsking(null);
    }
  }

  return (
    <section aria-labelledby="history-heading" className="no-print" data-testid="chart-history">
      <h2 id="history-heading" className="text-lg font-semibold">
        History
      </h2>
      <div aria-live="polite" className="mt-2">
        {outcome ? <Notice kind={outcome.kind}>{outcome.text}</Notice> : null}
      </div>
      {revisions === undefined ? (
        <p className="text-ink-muted">Loading the history…</p>
      ) : newestFirst.length === 0 ? (
        <p className="text-ink-muted">No earlier versions on this device yet.</p>
      ) : (
        <ol className="mt-2 divide-y divide-paper-dim rounded-lg border border-paper-dim bg-white">
          {newestFirst.map((rev, i) => (
            <li key={rev.revision} className="flex flex-wrap items-start justify-between gap-3 p-3" data-testid="history-entry" data-revision={rev.revision}>
              <div className="min-w-0">
                <p className="font-semibold">
                  Version {rev.revision}
                  {rev.revision === current ? <span className="ml-2 text-sm font-normal text-ink-muted">(current)</span> : null}
                </p>
                <p className="text-sm text-ink-soft">
                  {rev.authorName || "Someone"} · <time dateTime={rev.createdAt}>{formatDateTime(rev.createdAt)}</time>
                </p>
                {rev.message ? <p className="mt-1">“{rev.message}”</p> : null}
                <p className="mt-1 text-sm text-ink-muted">Changed: {describeChange(rev, newestFirst[i + 1]).join("; ")}</p>
              </div>
              {canRestore && rev.revision !== current ? (
                asking === rev.revision ? (
                  <div className="flex flex-wrap items-center gap-2" role="group" aria-label={`Restore version ${rev.revision}?`}>
                    <Button onClick={() => restore(rev.revision)} disabled={busy} data-testid="restore-confirm">
                      {busy ? "Restoring…" : `Yes, restore version ${rev.revision}`}
                    </Button>
                    <Button tone="secondary" onClick={() => setAsking(null)} disabled={busy}>
                      Keep current
                    </Button>
                  </div>
                ) : (
                  <Button tone="secondary" onClick={() => setAsking(rev.revision)} data-testid="restore-revision">
                    Restore this revision
                  </Button>
                )
              ) : null}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
