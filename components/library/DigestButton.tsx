"use client";
// For the leader and arrangers: mails every member a notice of the charts published since the last
// one. The result is read out (aria-live) so a screen-reader user hears it without moving focus.
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { useOnline } from "@/lib/offline/hooks";
import { apiErrorOf } from "@/lib/api-error";

type Outcome = { kind: "idle" } | { kind: "busy" } | { kind: "done" | "error"; text: string };

function describe(body: unknown): string {
  const r = body as { sent?: unknown; charts?: unknown } | null;
  const sent = typeof r?.sent === "number" ? r.sent : 0;
  const charts = typeof r?.charts === "number" ? r.charts : 0;
  if (charts === 0) return "Nothing new since the last notice: no mail sent.";
  const c = `${charts} ${charts === 1 ? "chart" : "charts"}`;
  return `Notice of ${c} sent to ${sent} ${sent === 1 ? "member" : "members"}.`;
}


export function DigestButton({ bandId }: { bandId: string }) {
  const online = useOnline();
  const [outcome, setOutcome] = useState<Outcome>({ kind: "idle" });

  async function send() {
    setOutcome({ kind: "busy" });
    const res = await fetch(`/api/bands/${encodeURIComponent(bandId)}/digest`, { method: "POST" }).catch(() => null);
    const body: unknown = res ? await res.json().catch(() => null) : null;
    setOutcome(res?.ok ? { kind: "done", text: describe(body) } : { kind: "error", text: apiErrorOf(body, "The notice could not be sent. Try again with a connection.").message });
  }

  const busy = outcome.kind === "busy";
  return (
    <div className="flex flex-col items-end gap-1">
      <Button
        tone="secondary"
        onClick={send}
        disabled={busy || !online}
        aria-describedby={`digest-status-${bandId}`}
        data-testid="send-digest"
      >
        {busy ? "Sending…" : "Send update notice"}
      </Button>
      <p
        id={`digest-status-${bandId}`}
        aria-live="polite"
        data-testid="digest-status"
        className={outcome.kind === "error" ? "text-sm text-red-800" : "text-sm text-ink-muted"}
      >
        {!online && outcome.kind === "idle"
          ? "Sending a notice needs a connection."
          : outcome.kind === "done" || outcome.kind === "error"
            ? outcome.text
            : ""}
      </p>
    </div>
  );
}
