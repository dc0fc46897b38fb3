"use client";
// The band's archived charts, for leaders and arrangers: bring one back into the book or delete it
// for good. Read from the server (the archive is not on players' devices), so it needs signal.
import { useCallback, useState } from "react";
import { Button } from "@/components/ui/Button";
import { ConfirmInline } from "@/components/ui/Confirm";
import { Notice } from "@/components/ui/Notice";
import { formatDateTime } from "@/components/ui/labels";
import { getSyncEngine } from "@/lib/offline/sync";
import { readApiError } from "@/lib/api-error";

interface Archived {
  id: string;
  title: string;
  concertKey: string;
  archivedAt: string;
  archivedBy: string;
}

export function ArchivedCharts({ bandId }: { bandId: string }) {
  const base = `/api/bands/${encodeURIComponent(bandId)}/archive`;
  const [charts, setCharts] = useState<Archived[] | null>(null);
  const [asking, setAsking] = useState<string | null>(null);
  const [result, setResult] = useState<{ kind: "success" | "error"; text: string } | null>(null);

  const load = useCallback(async () => {
    try {
      const res = await fetch(base);
      if (!res.ok) throw new Error(String(res.status));
      setCharts(((await res.json()) as { charts: Archived[] }).charts);
    } catch {
      setResult({ kind: "error", text: "The archive needs signal; try again when you are online." });
    }
  }, [base]);

  async function act(c: Archived, method: "POST" | "DELETE") {
    setAsking(null);
    const res = await fetch(`${base}/${encodeURIComponent(c.id)}`, { method }).catch(() => null);
    if (!res?.ok) {
      const fallback = "No signal: try again when you are online.";
      setResult({ kind: "error", text: res ? (await readApiError(res, fallback)).message : fallback });
      return;
    }
    setResult({ kind: "success", text: method === "POST" ? `“${c.title}” is back in the book.` : `“${c.title}” is deleted.` });
    if (method === "POST") void getSyncEngine().sync({ bandId, force: true }).catch(() => undefined);
    await load();
  }

  return (
    <details className="mt-8 rounded-lg border border-ink-soft p-3" onToggle={(e) => {
        // Read when first opened: most visits to the library never look in the archive.
        if (e.currentTarget.open && charts === null) void load();
      }} data-testid="archive">
      <summary className="min-h-11 cursor-pointer py-2 font-semibold">Archived charts</summary>
      <div aria-live="polite">{result ? <Notice kind={result.kind}>{result.text}</Notice> : null}</div>
      {charts === null ? (
        <p className="text-ink-muted">Opening the archive…</p>
      ) : charts.length === 0 ? (
        <p className="text-ink-muted">Nothing is archived.</p>
      ) : (
        <ul className="flex flex-col divide-y divide-paper-dim">
          {charts.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-2" data-testid="archived-chart">
              <span>
                <span className="font-semibold">{c.title}</span> ({c.concertKey}) · archived by {c.archivedBy},{" "}
                <time dateTime={c.archivedAt}>{formatDateTime(c.archivedAt)}</time>
              </span>
              {asking === c.id ? (
                <ConfirmInline question={`Delete “${c.title}” for good?`} confirmLabel="Yes, delete it" onConfirm={() => act(c, "DELETE")} onCancel={() => setAsking(null)} />
              ) : (
                <span className="flex gap-2">
                  <Button tone="secondary" onClick={() => act(c, "POST")} data-testid="bring-back">
                    Bring back
                  </Button>
                  <Button tone="danger" onClick={() => setAsking(c.id)}>
                    Delete
                  </Button>
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
    </details>
  );
}
