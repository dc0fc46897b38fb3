"use client";
// When a new version of the app has been downloaded, say so and let the player choose the moment
// to reload (never in the middle of a tune).
import { useSerwist } from "@serwist/next/react";
import { useEffect, useRef, useState } from "react";

export function UpdatePrompt() {
  const { serwist } = useSerwist();
  const [waiting, setWaiting] = useState(false);
  // Only a reload the player asked for: a first install taking control must not reload the page.
  const asked = useRef(false);

  useEffect(() => {
    if (!serwist) return;
    const onWaiting = () => setWaiting(true);
    const onControlling = () => {
      if (asked.current) window.location.reload();
    };
    serwist.addEventListener("waiting", onWaiting);
    serwist.addEventListener("controlling", onControlling);
    return () => {
      serwist.removeEventListener("waiting", onWaiting);
      serwist.removeEventListener("controlling", onControlling);
    };
  }, [serwist]);

  if (!waiting) return null;
  return (
    <div role="status" aria-live="polite" className="flex flex-wrap items-center gap-x-3 bg-brass-light px-4 py-1 text-sm text-ink" data-testid="update-prompt">
      <span>A new version of Pedalpoint is ready.</span>
      <button type="button" className="min-h-9 font-semibold underline" onClick={() => {
          asked.current = true;
          serwist?.messageSkipWaiting();
        }}>
        Reload now
      </button>
      <button type="button" className="min-h-9 underline" onClick={() => setWaiting(false)}>
        Later
      </button>
    </div>
  );
}
