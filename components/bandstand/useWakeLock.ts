"use client";
import { useEffect } from "react";

interface WakeLockSentinelLike {
  release: () => Promise<void>;
}
interface WakeLockLike {
  request: (type: "screen") => Promise<WakeLockSentinelLike>;
}

/** Keeps the screen on while mounted (where the browser allows it); released on leave. */
export function useWakeLock(active = true) {
  useEffect(() => {
    if (!active) return;
    const wl = (navigator as Navigator & { wakeLock?: WakeLockLike }).wakeLock;
    if (!wl) return;
    let sentinel: WakeLockSentinelLike | null = null;
    let gone = false;
    const acquire = () => {
      if (document.visibilityState !== "visible") return;
      wl.request("screen")
        .then((s) => {
          if (gone) void s.release();
          else sentinel = s;
        })
        .catch(() => {
          // Refused (battery saver, no user gesture yet): the chart still works, the screen may dim.
        });
    };
    acquire();
    // The browser drops the lock when the tab is hidden; take it again on return.
    document.addEventListener("visibilitychange", acquire);
    return () => {
      gone = true;
      document.removeEventListener("visibilitychange", acquire);
      void sentinel?.release();
    };
  }, [active]);
}
