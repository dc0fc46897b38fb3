// Builds the service worker after `next build` (Serwist configurator mode, see NOTES.md).
// The band page shells are found here, from the app's routes, so new pages are stored too.
import fs from "node:fs";
import path from "node:path";
import { serwist } from "@serwist/next/config";

const distDir = process.env.NEXT_DIST_DIR || ".next";

/** Same rule as lib/offline/sw-url.ts (the page registers this name). */
function serviceWorkerFile(dir) {
  const d = dir.replace(/^(\.\/)*\.?/, "").replace(/\/+$/, "");
  return !d || d === "next" ? "sw.js" : `sw-${d.replace(/[^A-Za-z0-9-]+/g, "-")}.js`;
}

/** Routes under app/bands that need the network (server-rendered, leader-only screens). */
const ONLINE_ONLY = [/\/members(\/|$)/];

function bandShells(dir = "app/bands", url = "/bands") {
  const out = [];
  if (fs.existsSync(path.join(dir, "page.tsx"))) out.push(url);
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (!entry.isDirectory() || entry.name.startsWith("_") || entry.name.startsWith("(")) continue;
    const segment = /^\[.+\]$/.test(entry.name) ? "_" : entry.name;
    out.push(...bandShells(path.join(dir, entry.name), `${url}/${segment}`));
  }
  return out.filter((u) => !ONLINE_ONLY.some((re) => re.test(u)));
}

const buildId = fs.existsSync(path.join(distDir, "BUILD_ID")) ? fs.readFileSync(path.join(distDir, "BUILD_ID"), "utf8").trim() : String(Date.now());

export default serwist({
  swSrc: "worker/sw.ts",
  swDest: `public/${serviceWorkerFile(distDir)}`,
  globPatterns: [
    `${distDir}/static/**/*.{js,css,woff2,woff,svg,png,ico,webp,json,webmanifest}`,
    "public/**/*.{svg,png,ico,webp,woff2,json,webmanifest,txt}",
  ],
  // Other builds' worker scripts in public/ are not part of this one. The fonts for other scripts
  // (public/fonts/world) are fetched slice by slice when a page needs them and kept by the font cache.
  globIgnores: ["public/sw*.js", "public/sw*.js.map", "public/fonts/world/**"],
  maximumFileSizeToCacheInBytes: 6 * 1024 * 1024,
  esbuildOptions: {
    define: {
      __PEDALPOINT_SHELLS__: JSON.stringify(JSON.stringify(bandShells())),
      __PEDALPOINT_BUILD__: JSON.stringify(buildId),
    },
  },
});
