// Where the service worker script is served. The default build (.next) uses /sw.js; a build into
// another folder (NEXT_DIST_DIR, for parallel local builds) gets its own script, so two builds in
// one checkout never precache each other's files. serwist.config.js writes to the same name.
export function serviceWorkerUrl(distDir: string | undefined): string {
  const dir = (distDir ?? "").replace(/^(\.\/)*\.?/, "").replace(/\/+$/, "");
  if (!dir || dir === "next") return "/sw.js";
  return `/sw-${dir.replace(/[^A-Za-z0-9-]+/g, "-")}.js`;
}
