"use client";
// Putting a chart away (archive: off every stand, kept for a leader or arranger to bring back) or
// deleting it. Both ask inline first. Archiving needs signal; the sync feed then takes it off devices.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { ConfirmInline } from "@/components/ui/Confirm";
import { Notice } from "@/components/ui/Notice";
import { deleteChart } from "@/lib/offline/mutations";
import { getSyncEngine } from "@/lib/offline/sync";
import { readApiError } from "@/lib/api-error";

type Asking = "archive" | "delete" | null;

export function ChartRemoval({ bandId, chartId, revision, title }: { bandId: string; chartId: string; revision: number; title: string }) {
  const router = useRouter();
  const [asking, setAsking] = useState<Asking>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const library = `/bands/${encodeURIComponent(bandId)}`;

  async function archive() {
    setBusy(true);
    setError(null);
    try {
      const res = await fetch(`/api/bands/${encodeURIComponent(bandId)}/archive`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ chartId }),
      });
      if (!res.ok) {
        setError((await readApiError(res, "The chart was not archived.")).message);
        return;
      }
      await getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
      router.push(library);
    } catch {
      setError("No signal: archiving needs the server. Try again when you are online.");
    } finally {
      setBusy(false);
      setAsking(null);
    }
  }

  async function remove() {
    setBusy(true);
    setError(null);
    try {
      const r = await deleteChart(bandId, chartId, revision);
      if (r.status === "saved" || r.status === "queued") router.push(library);
      else setError(r.message);
    } finally {
      setBusy(false);
      setAsking(null);
    }
  }

  return (
    <section aria-labelledby="removal-heading" className="mt-10 rounded-lg border border-ink-soft p-4" data-testid="chart-removal">
      <h2 id="removal-heading" className="text-lg font-semibold">Take it out of the book</h2>
      <p className="mb-3 text-sm text-ink-muted">
        Archive puts the chart away: it leaves every player&rsquo;s book and stops counting toward the plan, and a leader or
        arranger can bring it back from the library&rsquo;s archive. Delete removes it.
      </p>
      {asking === "archive" ? (
        <ConfirmInline question={`Archive “${title}” for the whole band?`} confirmLabel="Yes, archive it" tone="primary" busy={busy} onConfirm={archive} onCancel={() => setAsking(null)} testId="archive-confirm" />
      ) : asking === "delete" ? (
        <ConfirmInline question={`Delete “${title}” for the whole band?`} confirmLabel="Yes, delete it" busy={busy} onConfirm={remove} onCancel={() => setAsking(null)} testId="delete-chart-confirm" />
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button tone="secondary" onClick={() => setAsking("archive")} data-testid="archive-chart">
            Archive
          </Button>
          <Button tone="danger" onClick={() => setAsking("delete")} data-testid="delete-chart">
            Delete
          </Button>
        </div>
      )}
      <div aria-live="polite" className="mt-2">
        {error ? <Notice kind="error">{error}</Notice> : null}
      </div>
    </section>
  );
}
