"use client";
// Ready for tonight, for the leader: "6 of 7 devices ready" at a glance, and per member each device's
// last sync and what it is missing. Needs a connection (it asks the server what devices reported).
import { useCallback, useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import type { Readiness } from "@/lib/server/readiness-model";
import { useOnline } from "@/lib/offline/hooks";
import { readApiError } from "@/lib/api-error";

const REFRESH_MS = 10_000;

/** The server's answer, or null offline (the last answer stays on screen). */
async function fetchReadiness(url: string): Promise<Readiness | null> {
  try {
    const res = await fetch(url, { credentials: "same-origin", cache: "no-store" });
    return res.ok ? ((await res.json()) as { readiness: Readiness }).readiness : null;
  } catch {
    return null;
  }
}

const when = (iso: string) => new Date(iso).toLocaleString([], { weekday: "short", hour: "2-digit", minute: "2-digit" });

export function ReadinessPanel({ bandId, setlistId, canNudge }: { bandId: string; setlistId: string; canNudge: boolean }) {
  const online = useOnline();
  const [state, setState] = useState<Readiness | null>(null);
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState<string | null>(null);
  const base = `/api/bands/${encodeURIComponent(bandId)}/setlists/${encodeURIComponent(setlistId)}/readiness`;

  const load = useCallback(() => {
    fetchReadiness(base).then((r) => {
      if (r) setState(r);
    });
  }, [base]);

  useEffect(() => {
    if (!online) return;
    let gone = false;
    const get = () =>
      fetchReadiness(base).then((r) => {
        if (r && !gone) setState(r);
      });
    void get();
    const t = setInterval(() => void get(), REFRESH_MS);
    return () => {
      gone = true;
      clearInterval(t);
    };
  }, [online, base]);

  async function nudge() {
    setNote("Nudging…");
    try {
      const res = await fetch(`${base}/nudge`, { method: "POST", credentials: "same-origin", headers: { "content-type": "application/json" }, body: "{}" });
      if (!res.ok) return setNote((await readApiError(res, "The nudge did not go out.")).message);
      const { nudged } = (await res.json()) as { nudged?: { pushed: string[]; mailed: string[] } };
      if (!nudged) return setNote("The nudge did not go out.");
      const parts = [nudged.pushed.length ? `notice sent to ${nudged.pushed.join(", ")}` : "", nudged.mailed.length ? `e-mail sent to ${nudged.mailed.join(", ")}` : ""].filter(Boolean);
      setNote(parts.length ? `Nudged: ${parts.join("; ")}.` : "Everyone is ready; nobody to nudge.");
    } catch {
      setNote("No connection: the nudge did not go out.");
    }
  }

  if (!state) {
    return <p className="text-ink-muted" data-testid="readiness-loading">{online ? "Asking which devices are ready…" : "Who is ready shows when this device is online."}</p>;
  }
  const allReady = state.ready === state.total;
  return (
    <section aria-labelledby="readiness-title" className="rounded-lg border border-ink-soft p-3">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="readiness-title" className="text-lg font-bold">
          Ready for tonight:{" "}
          <span data-testid="readiness" data-ready={state.ready} data-total={state.total} className={allReady ? "text-green-800" : "text-red-800"}>
            {state.ready} of {state.total} devices ready
          </span>
        </h2>
        <Button tone="secondary" aria-expanded={open} onClick={() => setOpen(!open)} data-testid="readiness-details">
          {open ? "Hide devices" : "Show devices"}
        </Button>
        <Button tone="quiet" onClick={load}>Refresh</Button>
        {canNudge && !allReady ? (
          <Button tone="secondary" onClick={() => void nudge()} data-testid="nudge">Nudge those behind</Button>
        ) : null}
      </div>
      {note ? <p role="status" className="mt-2">{note}</p> : null}
      {open ? (
        <ul className="mt-3 flex flex-col gap-2">
          {state.members.map((m) => (
            <li key={m.userId} data-testid="ready-member" data-name={m.name} data-ready={m.ready ? "true" : "false"} className="rounded-md border border-ink-soft p-2">
              <p className="font-semibold">
                {m.name} <span className="font-normal text-ink-muted">({m.role})</span> — {m.ready ? "ready" : "not ready"}
              </p>
              <ul className="ml-4 list-disc text-sm">
                {m.devices.map((d, i) => (
                  <li key={d.deviceId ?? i} data-testid="ready-device" data-device={d.deviceId ?? undefined} data-ready={d.ready ? "true" : "false"}>
                    {d.label}
                    {d.lastSyncAt ? ` · last synced ${when(d.lastSyncAt)}` : null}
                    {d.ready ? " · holds everything" : ` · missing: ${d.missing.join(", ")}`}
                  </li>
                ))}
              </ul>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
