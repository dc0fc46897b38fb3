// Offline open benchmark (issue "fast on a phone", DESIGN.md §9): a signed-in device that synced the
// demo book and read a chart, then loses signal. Measured in Debian Chromium against `next start`,
// served by the service worker from its precache and the book in IndexedDB, medians of BENCH_RUNS:
//   - the last-read chart's address opened with no signal: navigation start → first page's SVG in the page;
//   - the library (the home-screen icon's start, /bands → the band): navigation start → first row shown,
//     and first contentful paint (never a blank screen).
// Needs a production build (npm run build). Env: BENCH_OFFLINE_PORT (3720), BENCH_RUNS (9).
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_BAND_ID, demoId } from "../../db/seed";

const root = path.resolve(import.meta.dirname, "../..");
const PORT = Number(process.env.BENCH_OFFLINE_PORT ?? 3720);
const RUNS = Number(process.env.BENCH_RUNS ?? 9);
const base = `http://localhost:${PORT}`;
const distDir = process.env.NEXT_DIST_DIR || ".next";
const chartUrl = `${base}/bands/${DEMO_BAND_ID}/charts/${demoId("chart:lanternfish")}`;
const libraryUrl = `${base}/bands/${DEMO_BAND_ID}`;

// Runs in the page before its own scripts: notes when the first chart SVG and the first library row
// appear, on the page's own clock (performance.now() counts from navigation start).
const WATCH = `(() => {
  const marks = (window.__ppMarks = {});
  new MutationObserver(() => {
    if (!marks.svg && document.querySelector('[data-testid="chart-page"] [data-sheet] svg')) marks.svg = performance.now();
    if (!marks.row && document.querySelector('[data-testid="library-row"]')) marks.row = performance.now();
  }).observe(document, { childList: true, subtree: true });
})();`;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? Number.NaN;

async function waitForHealth(): Promise<void> {
  for (let i = 0; i < 480; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error("the app did not start");
}

async function main() {
  if (!fs.existsSync(path.join(root, distDir, "BUILD_ID"))) {
    console.log(`no production build in ${distDir}: skipped (npm run build first)`);
    return;
  }
  const dataDir = path.join("data", `bench-offline-${PORT}`);
  const server = spawn(process.execPath, ["--import", "tsx", "scripts/start.ts", "--fresh", "--seed"], {
    cwd: root,
    stdio: "ignore",
    env: { ...process.env, PORT: String(PORT), DATABASE_PATH: path.join(dataDir, "pedalpoint.db"), DATA_DIR: dataDir, NEXTAUTH_URL: base, NEXTAUTH_SECRET: "bench-offline-only" },
  });
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-bench-offline-"));
  try {
    await waitForHealth();
    const context = await chromium.launchPersistentContext(profile, {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: ["--no-sandbox", "--headless", "--disable-gpu", "--disable-background-networking", "--no-first-run"],
      viewport: { width: 390, height: 844 },
    });
    const who = DEMO_ACCOUNTS.find((a) => a.role === "player")!;
    const page = context.pages()[0] ?? (await context.newPage());
    await page.goto(`${base}/signin?callbackUrl=${encodeURIComponent(`/bands/${DEMO_BAND_ID}`)}`);
    await page.getByLabel("Email", { exact: true }).fill(who.email);
    await page.getByLabel("Password", { exact: true }).fill(who.password);
    await page.getByRole("button", { name: /^sign in/i }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/signin"), { timeout: 60_000 });
    await page.goto(libraryUrl);
    await page.evaluate(async () => void (await navigator.serviceWorker.ready));
    await page.reload();
    await page.getByTestId("library-row").first().waitFor({ timeout: 60_000 });
    await page.goto(chartUrl);
    await page.locator('[data-testid="chart-page"][data-drawn-all="true"]').waitFor({ state: "attached", timeout: 60_000 });
    await context.addInitScript(WATCH);
    await context.setOffline(true);

    const svg: number[] = [];
    const rows: number[] = [];
    const fcp: number[] = [];
    for (let i = 0; i < RUNS + 1; i++) {
      await page.goto(chartUrl);
      await page.locator('[data-testid="chart-page"] [data-sheet] svg').first().waitFor({ state: "attached", timeout: 30_000 });
      const s = await page.evaluate(() => (window as unknown as { __ppMarks: { svg?: number } }).__ppMarks.svg ?? Number.NaN);
      await page.goto(libraryUrl);
      await page.getByTestId("library-row").first().waitFor({ timeout: 30_000 });
      const r = await page.evaluate(() => ({
        row: (window as unknown as { __ppMarks: { row?: number } }).__ppMarks.row ?? Number.NaN,
        fcp: performance.getEntriesByName("first-contentful-paint")[0]?.startTime ?? Number.NaN,
      }));
      // The first round warms the worker and the HTTP cache of the shell; it is not counted.
      if (i === 0) continue;
      svg.push(s);
      rows.push(r.row);
      fcp.push(r.fcp);
    }
    await context.close();
    console.log(`offline open, 390×844, medians of ${RUNS} (shared machine: noisy)`);
    console.log(`last-read chart: navigation start → first page's SVG ${median(svg).toFixed(0)} ms (target ≤ 300 ms; runs ${svg.map((x) => x.toFixed(0)).join(", ")})`);
    console.log(`library: navigation start → first row ${median(rows).toFixed(0)} ms (target ≤ 150 ms), first contentful paint ${median(fcp).toFixed(0)} ms`);
  } finally {
    server.kill("SIGTERM");
    fs.rmSync(profile, { recursive: true, force: true });
  }
}

await main();
