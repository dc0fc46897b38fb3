"use client";
// Band pages are client shells that the service worker may serve for any URL under /bands/,
// so ids come from the address bar, not from the route params baked into the served HTML.
import { usePathname } from "next/navigation";

export interface BandRoute {
  bandId: string | null;
  chartId: string | null;
  setlistId: string | null;
}

export function parseBandPath(pathname: string): BandRoute {
  const parts = pathname.split("/").filter(Boolean).map(decodeURIComponent);
  const at = (name: string) => {
    const i = parts.indexOf(name);
    const v = i >= 0 ? parts[i + 1] : undefined;
    return v && v !== "_" ? v : null;
  };
  return { bandId: at("bands"), chartId: at("charts"), setlistId: at("setlists") };
}

export function useBandRoute(): BandRoute {
  const pathname = usePathname();
  const live = typeof window !== "undefined" ? window.location.pathname : pathname;
  // In a client-side navigation the new page renders before the address bar changes, so the
  // router's path leads; the address bar speaks only for a served shell's "_" placeholders.
  const routed = pathname ? parseBandPath(pathname) : null;
  if (routed && !pathname.split("/").includes("_")) return routed;
  return parseBandPath(live || pathname);
}
