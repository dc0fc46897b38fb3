"use client";
// The band's plan, for the leader: what the band is on, its status and renewal date, how much of
// the free plan's room is used, and the way to the band plan (hosted checkout) or out of it.
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useCallback, useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { useOnline } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { PlanFacts, priceInWords, type PlanView } from "./PlanFacts";
import { apiErrorOf } from "@/lib/api-error";

type Load = { state: "loading" } | { state: "ready"; plan: PlanView } | { state: "error"; message: string };

async function call(url: string, init?: RequestInit): Promise<{ ok: boolean; body: Record<string, unknown> | null }> {
  const res = await fetch(url, { ...init, headers: { "content-type": "application/json", ...init?.headers } }).catch(() => null);
  const body = res ? ((await res.json().catch(() => null)) as Record<string, unknown> | null) : null;
  return { ok: !!res?.ok, body };
}

const messageOf = (body: Record<string, unknown> | null, fallback: string) => apiErrorOf(body, fallback).message;

export function PlanScreen() {
  const { bandId } = useBandRoute();
  const params = useSearchParams();
  const online = useOnline();
  const [load, setLoad] = useState<Load>({ state: "loading" });
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<{ kind: "success" | "error" | "info"; text: string } | null>(null);
  const [confirmCancel, setConfirmCancel] = useState(false);

  const refresh = useCallback(async () => {
    if (!bandId) return;
    const { ok, body } = await call(`/api/billing/plan?bandId=${encodeURIComponent(bandId)}`);
    setLoad(ok && body?.plan ? { state: "ready", plan: body.plan as PlanView } : { state: "error", message: messageOf(body, "The plan could not be loaded. It needs a connection.") });
  }, [bandId]);

  useEffect(() => {
    if (!bandId) return;
    const checkout = params.get("checkout");
    const session = params.get("session");
    (async () => {
      if (checkout === "done" && session) {
        await call("/api/billing/confirm", { method: "POST", body: JSON.stringify({ bandId, sessionId: session }) });
        setNotice({ kind: "success", text: "Thank you: the band plan is on. A receipt is on its way by e-mail." });
      } else if (checkout === "cancelled") setNotice({ kind: "info", text: "Checkout was left without paying; nothing changed." });
      await refresh();
    })();
  }, [bandId, params, refresh]);

  if (!bandId) return null;

  const act = async (path: string, done: string) => {
    setBusy(true);
    setNotice(null);
    const { ok, body } = await call(path, { method: "POST", body: JSON.stringify({ bandId }) });
    setBusy(false);
    if (!ok) return setNotice({ kind: "error", text: messageOf(body, "That did not work. Try again in a moment.") });
    if (typeof body?.url === "string") {
      window.location.assign(body.url);
      return;
    }
    if (body?.plan) setLoad({ state: "ready", plan: body.plan as PlanView });
    setNotice({ kind: "success", text: done });
  };

  return (
    <PageColumn>
      <PageTitle lead="The free plan keeps a small book; the band plan has no limits.">The band&apos;s plan</PageTitle>
      {!online ? <Notice kind="error" className="mb-4">The plan page needs a connection.</Notice> : null}
      {notice ? <Notice kind={notice.kind} className="mb-4" testId="plan-notice">{notice.text}</Notice> : null}
      {load.state === "loading" ? <p role="status">Loading the plan…</p> : null}
      {load.state === "error" ? <Notice kind="error" testId="plan-error">{load.message}</Notice> : null}
      {load.state === "ready" ? (
        <>
          <PlanFacts plan={load.plan} />
          <div className="mt-6 flex flex-wrap gap-3">
            {load.plan.plan === "free" ? (
              <p className="w-full" data-testid="plan-price">
                {load.plan.price
                  ? `The band plan costs ${priceInWords(load.plan.price)}, renews each ${load.plan.price.interval} and can be cancelled any time. You pay on the next page.`
                  : "The price is shown on the next page, before you pay."}
              </p>
            ) : null}
            {load.plan.plan === "free" ? (
              <Button onClick={() => void act("/api/billing/checkout", "")} disabled={busy || !online} data-testid="plan-upgrade">
                Move to the band plan
              </Button>
            ) : load.plan.cancelAtPeriodEnd ? (
              <Button onClick={() => void act("/api/billing/resume", "The band plan will renew as usual.")} disabled={busy || !online} data-testid="plan-resume">
                Keep the band plan
              </Button>
            ) : confirmCancel ? (
              <div className="flex flex-col gap-2" role="group" aria-label="Confirm cancelling">
                <p>The band keeps the band plan until the renewal date, then returns to the free plan&apos;s limits. No chart is deleted.</p>
                <div className="flex gap-3">
                  <Button tone="danger" onClick={() => void act("/api/billing/cancel", "Cancelled: the band plan runs until its renewal date.").then(() => setConfirmCancel(false))} disabled={busy} data-testid="plan-cancel-confirm">
                    Cancel the band plan
                  </Button>
                  <Button tone="secondary" onClick={() => setConfirmCancel(false)}>
                    Keep it
                  </Button>
                </div>
              </div>
            ) : (
              <Button tone="secondary" onClick={() => setConfirmCancel(true)} disabled={busy || !online} data-testid="plan-cancel">
                Cancel the band plan…
              </Button>
            )}
          </div>
        </>
      ) : null}
      <p className="mt-8 text-sm">
        <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}`}>
          Back to the library
        </Link>
      </p>
    </PageColumn>
  );
}
