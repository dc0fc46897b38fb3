"use client";
// Band pages are client shells that the service worker may serve for any URL under /bands/,
// so ids come from the address bar, not from the route params baked into the served HTML.
import { useParams, usePathname } from "next/navigation";
import { useSyncExternalStore } from "react";

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

const never = () => () => {};

/** False while React hydrates the server's HTML (and on the server), true from then on. */
export function useHydrated(): boolean {
  return useSyncExternalStore(never, () => true, () => false);
}

/** The ids the HTML was rendered with: a stored shell's "_" placeholders read as no id. */
function renderedRoute(params: Record<string, string | string[] | undefined> | null): BandRoute {
  const one = (v: string | string[] | undefined) => (typeof v === "string" && v !== "_" ? decodeURIComponent(v) : null);
  return { bandId: one(params?.bandId), chartId: one(params?.chartId), setlistId: one(params?.setlistId) };
}

export function useBandRoute(): BandRoute {
  const pathname = usePathname();
  const params = useParams();
  // A stored shell was rendered for "_" ids while the address bar names real ones: the first
  // (hydrating) render must match the HTML, so it reads the route's own params; the next render,
  // right after, reads the address.
  const hydrated = useHydrated();
  if (!hydrated) return renderedRoute(params);
  const live = typeof window !== "undefined" ? window.location.pathname : pathname;
  // In a client-side navigation the new page renders before the address bar changes, so the
  // router's path leads; the address bar speaks only for a served shell's "_" placeholders.
  const routed = pathname ? parseBandPath(pathname) : null;
  if (routed && !pathname.split("/").includes("_")) return routed;
  return parseBandPath(live || pathname);
}
