"use client";
// The change summary on the bandstand: over the page, out of the way of the tap zones, closed with one tap.
import { useState } from "react";
import { ChangeSummary } from "./ChangeSummary";
import { useChangeSince } from "./useChangeSince";

export function StageChanges({ chartId, instrument, tonightKey }: { chartId: string | null | undefined; instrument: string; tonightKey?: string | null }) {
  const since = useChangeSince(chartId);
  const [closed, setClosed] = useState<string | null>(null);
  if (!chartId || !since || closed === `${chartId}:${since.to}`) return null;
  return (
    <div className="fixed left-2 right-2 top-14 z-[60] mx-auto max-w-xl">
      <ChangeSummary chartId={chartId} instrument={instrument} tonightKey={tonightKey} stage />
      <button type="button" className="absolute right-2 top-2 rounded border border-amber-300/60 px-2 text-sm text-amber-100" onClick={() => setClosed(`${chartId}:${since.to}`)} data-testid="change-summary-close">
        Close
      </button>
    </div>
  );
}
