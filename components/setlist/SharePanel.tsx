"use client";
// The leader lends this set list to a sub: an e-mail with a link that works until an end time.
// Needs signal (the server sends the mail); the list of shares shows who has it and until when.
import { useCallback, useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field, TextAreaField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { readApiError } from "@/lib/api-error";
import { SHARING_CAUTION, type ShareState, type WireShare } from "@/lib/setlist";
import { fromLocalInput, gigWhen, toLocalInput } from "./datetime";


const STATE_WORDS: Record<ShareState, string> = {
  waiting: "link sent, not opened yet",
  accepted: "opened",
  ended: "ended",
  revoked: "withdrawn",
};

/** The default end: 06:00 the morning after the gig (or after now, with no date yet). */
export function defaultEnd(startsAt: string | null): string {
  const base = startsAt ? new Date(startsAt) : new Date();
  const end = new Date(base.getTime() + 24 * 3_600_000);
  end.setHours(6, 0, 0, 0);
  return end.toISOString();
}

export function SharePanel({ bandId, setlistId, startsAt }: { bandId: string; setlistId: string; startsAt: string | null }) {
  const base = `/api/bands/${encodeURIComponent(bandId)}/setlists/${encodeURIComponent(setlistId)}/shares`;
  const [shares, setShares] = useState<WireShare[] | null>(null);
  const [email, setEmail] = useState("");
  // Until the leader picks an end, it follows the gig's time as shown on the screen (saved or not).
  const [picked, setPicked] = useState<string | null>(null);
  const until = picked ?? toLocalInput(defaultEnd(startsAt));
  const [message, setMessage] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ kind: "success" | "error"; text: string; field?: string } | null>(null);

  const [version, setVersion] = useState(0);
  const load = useCallback(() => setVersion((v) => v + 1), []);
  useEffect(() => {
    let alive = true;
    fetch(base)
      .then((res) => (res.ok ? (res.json() as Promise<{ shares: WireShare[] }>) : null))
      .then((body) => {
        if (alive && body) setShares(body.shares);
      })
      .catch(() => undefined);
    return () => {
      alive = false;
    };
  }, [base, version]);

  async function share(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setResult(null);
    try {
      const res = await fetch(base, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ email, expiresAt: fromLocalInput(until), message }),
      });
      if (!res.ok) {
        const error = await readApiError(res, "Not shared.");
        setResult({ kind: "error", text: error.message, field: error.field });
      } else {
        const body = (await res.json()) as { mailed?: boolean };
        setResult({ kind: "success", text: body.mailed ? `Sent to ${email}.` : `Shared, but the e-mail could not be sent. Try again later.` });
        setEmail("");
        setMessage("");
        load();
      }
    } catch {
      setResult({ kind: "error", text: "No signal: sharing needs the server to send the e-mail. Try again when you are online." });
    } finally {
      setBusy(false);
    }
  }

  async function withdraw(id: string) {
    setResult(null);
    const res = await fetch(`${base}/${encodeURIComponent(id)}`, { method: "DELETE" }).catch(() => null);
    // A withdraw that did not happen is said: the sub still has the set list.
    if (!res) setResult({ kind: "error", text: "No signal: the share was not withdrawn. Try again when you are online." });
    else if (!res.ok) setResult({ kind: "error", text: `Not withdrawn: ${(await readApiError(res, "the server refused.")).message}` });
    load();
  }

  return (
    <section aria-labelledby="share-title" className="rounded-lg border border-ink-soft p-4" data-testid="share-panel">
      <h2 id="share-title" className="text-xl font-bold">Share with a sub</h2>
      <p className="mb-3 text-sm text-ink-muted">
        The sub gets this set list and its charts only, on their own device and offline too, until the end time. {SHARING_CAUTION}
      </p>
      <form onSubmit={share} className="grid gap-3 sm:grid-cols-2" noValidate>
        <Field label="Sub's e-mail" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} error={result?.field === "email" ? result.text : null} data-testid="share-email" />
        <Field label="Access ends (your time zone)" type="datetime-local" required value={until} onChange={(e) => setPicked(e.target.value)} error={result?.field === "expiresAt" ? result.text : null} data-testid="share-until" />
        <TextAreaField label="A line for the e-mail (optional)" className="sm:col-span-2" rows={2} maxLength={500} value={message} onChange={(e) => setMessage(e.target.value)} />
        <div className="sm:col-span-2">
          <Button type="submit" disabled={busy || !email} data-testid="share-send">
            {busy ? "Sending…" : "Send the link"}
          </Button>
        </div>
      </form>
      <div aria-live="polite" className="mt-3">
        {result ? <Notice kind={result.kind} testId="share-result">{result.text}</Notice> : null}
      </div>
      {shares && shares.length > 0 ? (
        <ul className="mt-4 flex flex-col gap-2" aria-label="Shares of this set list">
          {shares.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 border-b border-ink-soft py-2" data-testid="share-row">
              <span>
                <span className="font-semibold">{s.email}</span> · until {gigWhen(s.expiresAt)} · {STATE_WORDS[s.state]}
              </span>
              {s.state === "waiting" || s.state === "accepted" ? (
                <Button tone="danger" onClick={() => withdraw(s.id)} aria-label={`Withdraw the share for ${s.email}`}>
                  Withdraw
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
