// Push and calling-the-tune benchmark (issue 11). Prints:
//   - the server's cost of fanning one change out to 100 subscribed devices: wall time and this
//     process's CPU time, encryption and VAPID signing included (median of 7), against the local push
//     fake in its own process (so its decrypting is not counted);
//   - publish → follower shows the called tune: from the leader's call to the follower's bandstand
//     view showing that tune (median of 20), in headless Chromium against the production build
//     (skipped, and said so, when there is no build).
// Env: BENCH_PUSH_PORT (3660; the fake uses +1), BENCH_PUSH_DEVICES (100), CHROMIUM_PATH.
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { rerunWithServerOnlyStub } from "./server-only-hook";

rerunWithServerOnlyStub();

const root = path.resolve(import.meta.dirname, "../..");
const APP_PORT = Number(process.env.BENCH_PUSH_PORT ?? 3660);
const FAKE_PORT = APP_PORT + 1;
const DEVICES = Number(process.env.BENCH_PUSH_DEVICES ?? 100);
const distDir = process.env.NEXT_DIST_DIR || ".next";

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? NaN;
};

async function waitFor(url: string, child: ChildProcess, tries = 600): Promise<void> {
  for (let i = 0; i < tries && child.exitCode === null; i++) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not come up`);
}

function tsx(file: string, env: Record<string, string>): ChildProcess {
  return spawn(process.execPath, ["--import", "tsx", file], { cwd: root, env: { ...process.env, ...env }, stdio: ["ignore", "ignore", "inherit"] });
}

async function fanOutBench(): Promise<void> {
  const { migrateToLatest, openDatabase } = await import("../../db/connection");
  const { fanOut } = await import("../../lib/server/push");
  const fake = tsx("scripts/push-fake.ts", { PUSH_FAKE_PORT: String(FAKE_PORT) });
  const origin = `http://127.0.0.1:${FAKE_PORT}`;
  process.env.PUSH_FAKE_ORIGIN = origin;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-push-bench-"));
  const db = openDatabase(path.join(dir, "bench.db"));
  try {
    await waitFor(`${origin}/messages`, fake);
    await migrateToLatest(db);
    const now = new Date().toISOString();
    const leader = randomUUID();
    const bandId = randomUUID();
    await db.insertInto("users").values({ id: leader, email: "lead@bench.test", name: "Lead", password_hash: null, default_instrument: "concert", created_at: now }).execute();
    await db.insertInto("bands").values({ id: bandId, name: "Bench Band", city: null, created_by: leader, created_at: now }).execute();
    await db.insertInto("memberships").values({ band_id: bandId, user_id: leader, role: "leader", instrument: "concert", expires_at: null, created_at: now }).execute();
    for (let i = 0; i < DEVICES; i++) {
      const user = randomUUID();
      await db.insertInto("users").values({ id: user, email: `p${i}@bench.test`, name: `Player ${i}`, password_hash: null, default_instrument: "concert", created_at: now }).execute();
      await db.insertInto("memberships").values({ band_id: bandId, user_id: user, role: "player", instrument: "concert", expires_at: null, created_at: now }).execute();
      const sub = (await (await fetch(`${origin}/subscribers`, { method: "POST", body: "{}" })).json()) as { endpoint: string; keys: { p256dh: string; auth: string } };
      await db.insertInto("push_subscriptions").values({ id: randomUUID(), band_id: bandId, user_id: user, device_id: `d${i}`, endpoint: sub.endpoint, p256dh: sub.keys.p256dh, auth: sub.keys.auth, created_at: now, last_sent_at: null }).execute();
    }
    await fanOut(db, { bandId, authorId: leader, kind: "chart", chartIds: ["warm-up"] });
    const walls: number[] = [];
    const cpus: number[] = [];
    for (let run = 0; run < 7; run++) {
      const cpu0 = process.cpuUsage();
      const t0 = performance.now();
      const r = await fanOut(db, { bandId, authorId: leader, kind: "chart", chartIds: [`c${run}`] });
      walls.push(performance.now() - t0);
      const cpu = process.cpuUsage(cpu0);
      cpus.push((cpu.user + cpu.system) / 1000);
      if (r.sent !== DEVICES) throw new Error(`sent ${r.sent} of ${DEVICES}`);
    }
    const wall = median(walls);
    const cpu = median(cpus);
    console.log(`fan-out of one change to ${DEVICES} subscribed devices: ${wall.toFixed(1)} ms wall, ${cpu.toFixed(1)} ms CPU (${(cpu / DEVICES).toFixed(2)} ms CPU per device), median of 7`);
  } finally {
    await db.destroy();
    fake.kill("SIGTERM");
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

async function callBench(): Promise<void> {
  if (!fs.existsSync(path.join(root, distDir, "BUILD_ID"))) {
    console.log(`publish → follower shows the called tune: skipped (no production build in ${distDir}; run npm run build first)`);
    return;
  }
  const { chromium } = await import("@playwright/test");
  const { DEMO_ACCOUNTS, DEMO_BAND_ID, demoId } = await import("../../db/seed");
  const dataDir = path.join("data", "bench-push");
  const base = `http://localhost:${APP_PORT}`;
  const app = spawn(process.execPath, ["--import", "tsx", "scripts/start.ts", "--fresh", "--seed"], {
    cwd: root,
    env: { ...process.env, PORT: String(APP_PORT), DATABASE_PATH: path.join(dataDir, "pedalpoint.db"), DATA_DIR: dataDir, NEXTAUTH_URL: base, NEXTAUTH_SECRET: "bench-only-secret", MAIL_FAKE: "", PAYMENT_FAKE: "", PUSH_FAKE: "" },
    stdio: ["ignore", "ignore", "inherit"],
    detached: true,
  });
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--no-sandbox", "--headless", "--disable-gpu"] });
  try {
    await waitFor(`${base}/api/health`, app);
    const signIn = async (email: string, password: string) => {
      const ctx = await browser.newContext({ baseURL: base });
      const page = await ctx.newPage();
      await page.goto(`/signin?callbackUrl=${encodeURIComponent(`/bands/${DEMO_BAND_ID}`)}`);
      await page.getByLabel("Email", { exact: true }).fill(email);
      await page.getByLabel("Password", { exact: true }).fill(password);
      await page.getByRole("button", { name: /^sign in/i }).click();
      await page.waitForURL((u) => !u.pathname.startsWith("/signin"), { timeout: 60_000 });
      return page;
    };
    const lead = DEMO_ACCOUNTS.find((a) => a.role === "leader")!;
    const player = DEMO_ACCOUNTS.find((a) => a.role === "player")!;
    const leader = await signIn(lead.email, lead.password);
    const charts = [demoId("chart:lanternfish"), demoId("chart:tidewater-waltz")];
    const entries = charts.map((chartId, position) => ({ id: randomUUID(), chartId, setNumber: 1, position }));
    const made = await leader.request.post(`/api/bands/${DEMO_BAND_ID}/setlists`, { headers: { origin: base }, data: { name: "Bench gig", startsAt: null, venue: "", notes: "", entries } });
    const setlist = ((await made.json()) as { setlist: { id: string } }).setlist;
    const follower = await signIn(player.email, player.password);
    await follower.goto(`/bands/${DEMO_BAND_ID}/setlists/${setlist.id}/play`);
    await follower.getByTestId("head-title").waitFor({ timeout: 60_000 });
    await follower.getByTestId("follow-toggle").click();
    await follower.waitForTimeout(1000);
    const titles = ["Lanternfish", "Tidewater Waltz"];
    const times: number[] = [];
    for (let i = 0; i < 21; i++) {
      const to = (i + 1) % 2;
      const t0 = Date.now();
      await leader.request.post(`/api/bands/${DEMO_BAND_ID}/setlists/${setlist.id}/calls`, { headers: { origin: base }, data: { entryId: entries[to]!.id } });
      await follower.waitForFunction((t) => document.querySelector('[data-testid="head-title"]')?.textContent === t && document.querySelector('[data-testid="chart-page"]')?.getAttribute("data-drawn") === "true", titles[to], { polling: "raf", timeout: 10_000 });
      if (i > 0) times.push(Date.now() - t0); // the first call warms up the follower's drawing code
    }
    console.log(`publish → follower shows the called tune (drawn): median ${median(times)} ms of ${times.length}, slowest ${Math.max(...times)} ms`);
  } finally {
    await browser.close();
    if (app.pid) process.kill(-app.pid, "SIGTERM");
    fs.rmSync(path.join(root, dataDir), { recursive: true, force: true });
  }
}

await fanOutBench();
await callBench();
process.exit(0);
