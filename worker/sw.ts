/// <reference lib="webworker" />
// Pedalpoint's service worker: the app itself (shell, code, fonts, notation) is stored at install so
// a player can open the library, a chart and the bandstand view with no signal. The book lives in
// IndexedDB (lib/offline), never in the HTTP cache, so API calls always go to the network.
import type { PrecacheEntry, RouteHandlerCallbackOptions, SerwistGlobalConfig } from "serwist";
import { CacheFirst, ExpirationPlugin, NetworkOnly, Serwist, StaleWhileRevalidate } from "serwist";
import { getSyncEngine } from "../lib/offline/sync";
import { registerPushHandlers } from "./push";
import { matchShell } from "./shells";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;
/** Filled in at build time by serwist.config.js: the band page patterns and the build id. */
declare const __PEDALPOINT_SHELLS__: string;
declare const __PEDALPOINT_BUILD__: string;

const SHELLS: string[] = JSON.parse(__PEDALPOINT_SHELLS__) as string[];
const SHELL_CACHE = `pedalpoint-shells-${__PEDALPOINT_BUILD__}`;
const OFFLINE_PAGE = "/~offline";

/** Stores every band page shell. One that fails to load is skipped, never the whole install. */
async function storeShells(): Promise<void> {
  const cache = await caches.open(SHELL_CACHE);
  await Promise.allSettled(
    SHELLS.map(async (url) => {
      const res = await fetch(url, { credentials: "same-origin", cache: "no-store" });
      if (res.ok && !res.redirected) await cache.put(url, res);
    }),
  );
}

async function dropOldShells(): Promise<void> {
  for (const name of await caches.keys()) if (name.startsWith("pedalpoint-shells-") && name !== SHELL_CACHE) await caches.delete(name);
}

/** Any address under /bands/ gets the stored shell of its route pattern; the network only if none is stored. */
async function bandPage({ request, url }: RouteHandlerCallbackOptions): Promise<Response> {
  const shell = matchShell(url.pathname, SHELLS);
  if (shell) {
    const hit = await (await caches.open(SHELL_CACHE)).match(shell);
    if (hit) return hit;
  }
  try {
    return await fetch(request);
  } catch {
    return (await serwist.matchPrecache(OFFLINE_PAGE)) ?? Response.error();
  }
}

const isRsc = (request: Request) => request.headers.get("RSC") === "1";

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  // A new version waits until the player says "reload" (components/sync/UpdatePrompt.tsx),
  // so a page already open never loses the code it was loaded with in the middle of a set.
  skipWaiting: false,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    { matcher: ({ request, url, sameOrigin }) => sameOrigin && request.mode === "navigate" && /^\/bands(\/|$)/.test(url.pathname), handler: bandPage },
    // The book syncs into IndexedDB; sign-in, sync and every other API call go to the network only.
    { matcher: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith("/api/"), handler: new NetworkOnly() },
    // Page data for client navigation: fail fast offline so the router falls back to a full load (served above).
    { matcher: ({ request, sameOrigin }) => sameOrigin && isRsc(request), handler: new NetworkOnly() },
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith("/_next/static/"),
      handler: new CacheFirst({ cacheName: "pedalpoint-static", plugins: [new ExpirationPlugin({ maxEntries: 300, maxAgeSeconds: 30 * 86_400 })] }),
    },
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && /\.(?:woff2?|ttf|otf)$/i.test(url.pathname),
      handler: new CacheFirst({ cacheName: "pedalpoint-fonts", plugins: [new ExpirationPlugin({ maxEntries: 40 })] }),
    },
    {
      matcher: ({ url, sameOrigin }) => sameOrigin && /\.(?:png|svg|ico|webp|jpg|jpeg)$/i.test(url.pathname),
      handler: new StaleWhileRevalidate({ cacheName: "pedalpoint-images", plugins: [new ExpirationPlugin({ maxEntries: 100 })] }),
    },
  ],
  fallbacks: {
    entries: [{ url: OFFLINE_PAGE, matcher: ({ request }) => request.destination === "document" }],
  },
});

self.addEventListener("install", (event) => event.waitUntil(storeShells()));
self.addEventListener("activate", (event) => event.waitUntil(dropOldShells()));

// Background Sync: send the outbox when signal returns, even with every tab closed.
self.addEventListener("sync", (event: Event) => {
  const e = event as ExtendableEvent & { tag?: string };
  if (e.tag !== "pedalpoint-outbox") return;
  e.waitUntil(
    getSyncEngine()
      .pushAll()
      .then(async () => {
        for (const client of await self.clients.matchAll({ type: "window" })) client.postMessage({ type: "pedalpoint-synced" });
      }),
  );
});

registerPushHandlers();
serwist.addEventListeners();
