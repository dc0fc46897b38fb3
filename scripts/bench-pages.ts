// `npm run bench:pages`: first load of the pages a player opens on a phone, measured by Lighthouse 12
// (mobile profile, simulated throttling, performance only) against `next start` of the demo band.
// Signs in with Playwright (Debian Chromium), passes the session cookie to Lighthouse, runs each page
// BENCH_LH_RUNS times (default 3) and prints medians of score, LCP, TBT, total bytes and the
// compressed JavaScript + font bytes, beside the targets of DESIGN.md §9. A fresh Lighthouse profile
// has an empty IndexedDB, so each run includes the device's first sync of the book.
// Needs a production build (`npm run build`; NEXT_DIST_DIR as for `next start`).
// Env: BENCH_PAGES_PORT (3710), BENCH_LH_RUNS (3), CHROME_PATH (/usr/bin/chromium).
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_BAND_ID, demoId } from "../db/seed";

const root = path.resolve(import.meta.dirname, "..");
const PORT = Number(process.env.BENCH_PAGES_PORT ?? 3710);
const RUNS = Number(process.env.BENCH_LH_RUNS ?? 3);
const CHROME = process.env.CHROME_PATH ?? "/usr/bin/chromium";
const base = `http://localhost:${PORT}`;
const distDir = process.env.NEXT_DIST_DIR || ".next";
const chart = demoId("chart:lanternfish");

const PAGES = [
  { name: "library", url: `/bands/${DEMO_BAND_ID}`, maxBytes: null },
  { name: "chart page", url: `/bands/${DEMO_BAND_ID}/charts/${chart}`, maxBytes: 300 * 1024 },
  { name: "bandstand view", url: `/bands/${DEMO_BAND_ID}/charts/${chart}/bandstand`, maxBytes: 300 * 1024 },
];

interface Figures {
  score: number;
  lcp: number;
  tbt: number;
  bytes: number;
  jsFontBytes: number;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? Number.NaN;

async function waitForHealth(): Promise<void> {
  for (let i = 0; i < 480; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error("the app did not start");
}

/** Signs in through the real sign-in page and returns the Cookie header for Lighthouse. */
async function sessionCookie(): Promise<string> {
  const who = DEMO_ACCOUNTS.find((a) => a.role === "player")!;
  const browser = await chromium.launch({ executablePath: CHROME, args: ["--no-sandbox", "--headless", "--disable-gpu"] });
  try {
    const page = await browser.newPage();
    await page.goto(`${base}/signin?callbackUrl=${encodeURIComponent(`/bands/${DEMO_BAND_ID}`)}`);
    await page.getByLabel("Email", { exact: true }).fill(who.email);
    await page.getByLabel("Password", { exact: true }).fill(who.password);
    await page.getByRole("button", { name: /^sign in/i }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/signin"), { timeout: 60_000 });
    const cookies = await page.context().cookies();
    if (!cookies.some((c) => c.name.includes("session-token"))) throw new Error("sign-in did not set a session cookie");
    return cookies.map((c) => `${c.name}=${c.value}`).join("; ");
  } finally {
    await browser.close();
  }
}

function lighthouse(url: string, headersFile: string, out: string): Figures {
  const cli = path.join(root, "node_modules/lighthouse/cli/index.js");
  const r = spawnSync(
    process.execPath,
    [
      cli,
      url,
      "--quiet",
      "--only-categories=performance",
      "--output=json",
      `--output-path=${out}`,
      `--extra-headers=${headersFile}`,
      '--chrome-flags=--headless=new --no-sandbox --disable-dev-shm-usage --disable-gpu',
    ],
    { env: { ...process.env, CHROME_PATH: CHROME }, stdio: ["ignore", "ignore", "inherit"], timeout: 240_000 },
  );
  if (r.status !== 0) throw new Error(`lighthouse exited with ${r.status} on ${url}`);
  const lhr = JSON.parse(fs.readFileSync(out, "utf8")) as {
    categories: { performance: { score: number } };
    audits: Record<string, { numericValue?: number; details?: { items?: { resourceType?: string; transferSize?: number; sessionTargetType?: string }[] } }>;
  };
  // The page's own requests: the service worker's precache downloads are not what the page waits for.
  const requests = (lhr.audits["network-requests"]?.details?.items ?? []).filter((q) => (q.sessionTargetType ?? "page") === "page");
  return {
    score: Math.round(lhr.categories.performance.score * 100),
    lcp: lhr.audits["largest-contentful-paint"]?.numericValue ?? Number.NaN,
    tbt: lhr.audits["total-blocking-time"]?.numericValue ?? Number.NaN,
    bytes: lhr.audits["total-byte-weight"]?.numericValue ?? Number.NaN,
    jsFontBytes: requests.filter((q) => q.resourceType === "Script" || q.resourceType === "Font").reduce((n, q) => n + (q.transferSize ?? 0), 0),
  };
}

async function main() {
  if (!fs.existsSync(path.join(root, distDir, "BUILD_ID"))) throw new Error(`no production build in ${distDir}: run npm run build first`);
  const work = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-bench-pages-"));
  const dataDir = path.join("data", `bench-pages-${PORT}`);
  const server = spawn(process.execPath, ["--import", "tsx", "scripts/start.ts", "--fresh", "--seed"], {
    cwd: root,
    stdio: "ignore",
    env: {
      ...process.env,
      PORT: String(PORT),
      DATABASE_PATH: path.join(dataDir, "pedalpoint.db"),
      DATA_DIR: dataDir,
      NEXTAUTH_URL: base,
      NEXTAUTH_SECRET: "bench-pages-only-secret",
    },
  });
  try {
    await waitForHealth();
    const headersFile = path.join(work, "headers.json");
    fs.writeFileSync(headersFile, JSON.stringify({ Cookie: await sessionCookie() }));
    console.log(`Lighthouse ${RUNS}× per page (mobile, simulated throttling), medians; shared machine, so timings are noisy`);
    console.log("page            | score (≥ 90) | LCP (≤ 2.5 s) | TBT (≤ 200 ms) | bytes              | JS + fonts");
    for (const p of PAGES) {
      const runs: Figures[] = [];
      for (let i = 0; i < RUNS; i++) runs.push(lighthouse(`${base}${p.url}`, headersFile, path.join(work, `lh-${i}.json`)));
      const m = (k: keyof Figures) => median(runs.map((r) => r[k]));
      const bytes = `${(m("bytes") / 1024).toFixed(0)} KB${p.maxBytes ? ` (≤ ${p.maxBytes / 1024} KB)` : ""}`;
      console.log(
        `${p.name.padEnd(15)} | ${String(m("score")).padEnd(12)} | ${(m("lcp") / 1000).toFixed(2).padStart(6)} s      | ${m("tbt").toFixed(0).padStart(6)} ms      | ${bytes.padEnd(18)} | ${(m("jsFontBytes") / 1024).toFixed(0)} KB`,
      );
    }
  } finally {
    server.kill("SIGTERM");
    fs.rmSync(work, { recursive: true, force: true });
  }
}

await main();
