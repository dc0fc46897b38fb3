// Sync benchmark (DESIGN.md §9). Prints:
//   - first sync of a 1,000-chart book into a device (time, bytes), through the sync route;
//   - a delta sync after one changed chart (time, bytes, and its share of the full download);
//   - pull pages (50 changes each) and empty polls per second the route serves on loopback
//     (autocannon), each beside its floor: a bare route in the same build and process answering the
//     same bytes (app/api/bench/floor, on only under PEDALPOINT_BENCH_FLOOR), plain and gzipped;
//     BENCH_ROUNDS (3) alternating rounds, medians, because the machine is shared;
//   - the same pull built in-process, without HTTP, for comparison.
// Against the real Next route when a production build exists (NEXT_DIST_DIR, default .next), else
// against a bare node:http wrapper of the same server code (and says so).
// Env: BENCH_SYNC_PORT (3305), BENCH_SECONDS (5), BENCH_ROUNDS (3), BENCH_CHARTS (1000), BENCH_NODE_ARGS (node flags for the server).
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { rerunWithServerOnlyStub } from "./server-only-hook";
import { signInWithPassword } from "../sign-in-client";

rerunWithServerOnlyStub();

const root = path.resolve(import.meta.dirname, "../..");
const PORT = Number(process.env.BENCH_SYNC_PORT ?? 3305);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const CHARTS = Number(process.env.BENCH_CHARTS ?? 1000);
const distDir = process.env.NEXT_DIST_DIR || ".next";
const PASSWORD = "bench-only-password";

const { migrateToLatest, openDatabase } = await import("../../db/connection");
const { createChart, updateChart } = await import("../../lib/server/charts");
const { pullChanges } = await import("../../lib/server/sync");
const { hashPassword } = await import("../../lib/server/users");
const { LocalBook } = await import("../../lib/offline/db");
const { SyncEngine } = await import("../../lib/offline/sync");
const { IDBKeyRange, indexedDB } = await import("fake-indexeddb");
const { measureRatios } = await import("./_ratios");

const ROOTS = ["C", "D", "Eb", "F", "G", "Ab", "Bb"];
const QUALITIES = ["maj7", "m7", "7", "m7b5", "7b9", "6", "m9", "13"];

/** An invented 32-bar chart text (four 8-bar sections), different for each index. */
function chartText(i: number): string {
  const lines = [`title: Bench Tune ${String(i).padStart(4, "0")}`, "key: F", "time: 4/4", "tempo: 144", "feel: medium swing", ""];
  for (const label of ["A", "B", "C", "D"]) {
    lines.push(`${label}:`);
    for (let row = 0; row < 2; row++) {
      const bars = [];
      for (let b = 0; b < 4; b++) {
        const k = i * 31 + label.charCodeAt(0) * 7 + row * 5 + b;
        bars.push(`${ROOTS[k % ROOTS.length]}${QUALITIES[(k >> 2) % QUALITIES.length]} ${ROOTS[(k + 3) % ROOTS.length]}${QUALITIES[(k >> 1) % QUALITIES.length]}`);
      }
      lines.push(`| ${bars.join(" | ")} |`);
    }
  }
  return lines.join("\n") + "\n";
}

async function seed(file: string) {
  const db = openDatabase(file);
  await migrateToLatest(db);
  const now = new Date().toISOString();
  const leader = { userId: randomUUID(), email: `bench-leader-${Date.now()}@bench.test`, name: "Bench Leader" };
  await db.insertInto("users").values({ id: leader.userId, email: leader.email, name: leader.name, password_hash: await hashPassword(PASSWORD), default_instrument: "concert", created_at: now }).execute();
  const bandId = randomUUID();
  await db.insertInto("bands").values({ id: bandId, name: "Bench Band", city: null, created_by: leader.userId, created_at: now }).execute();
  await db.insertInto("memberships").values({ band_id: bandId, user_id: leader.userId, role: "leader", instrument: "concert", expires_at: null, created_at: now }).execute();
  // A big book needs the band plan.
  await db.insertInto("subscriptions").values({ band_id: bandId, plan: "band", status: "active", customer_id: null, subscription_id: null, current_period_end: null, cancel_at_period_end: 0, updated_at: now }).execute();
  const ids: string[] = [];
  for (let i = 0; i < CHARTS; i++) {
    const text = chartText(i);
    const c = await createChart(db, leader, bandId, { title: `Bench Tune ${i}`, composer: "Bench", key: "F", meter: "4/4", tempo: 144, feel: "medium swing", sourceText: text, message: "" });
    ids.push(c.id);
  }
  return { db, leader, bandId, ids };
}

async function waitFor(url: string, child: ChildProcess | null): Promise<boolean> {
  for (let i = 0; i < 240 && (!child || child.exitCode === null); i++) {
    try {
      if ((await fetch(url)).ok) return true;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

/** Signs in through next-auth's credentials callback and returns the cookie header. */
function signIn(base: string, email: string): Promise<string> {
  return signInWithPassword(base, email, PASSWORD);
}

/** The same server code behind a bare node:http server (when no Next build is there to start). */
function bareServer(db: Awaited<ReturnType<typeof seed>>["db"], actor: { userId: string; email: string; name: string }) {
  return http.createServer(async (req, res) => {
    const url = new URL(req.url ?? "/", "http://x");
    const m = /^\/api\/bands\/([^/]+)\/sync$/.exec(url.pathname);
    if (url.pathname === "/api/me/bootstrap") {
      const b = await db.selectFrom("bands").select(["id", "name"]).execute();
      res.setHeader("content-type", "application/json");
      res.end(JSON.stringify({ user: { id: actor.userId, email: actor.email, name: actor.name }, bands: b.map((x) => ({ ...x, role: "leader", instrument: "concert", expiresAt: null })) }));
    } else if (m && req.method === "GET") {
      const q = Object.fromEntries(url.searchParams);
      const body = await pullChanges(db, actor, decodeURIComponent(m[1]!), { since: Number(q.since ?? 0), limit: Number(q.limit ?? 100), scope: q.scope, count: q.count === "1" ? "1" : undefined });
      res.setHeader("content-type", "application/json");
      res.end(body);
    } else if (m) {
      res.setHeader("content-type", "application/json");
      res.end('{"results":[]}');
    } else {
      res.statusCode = 404;
      res.end();
    }
  });
}

function deviceTransport(base: string, cookie: string, count: { bytes: number; requests: number }) {
  return {
    async fetch(p: string, init?: RequestInit) {
      const res = await fetch(`${base}${p}`, { ...init, headers: { ...(init?.headers as Record<string, string>), cookie } });
      const text = await res.text();
      count.bytes += Buffer.byteLength(text);
      count.requests++;
      return new Response(text, { status: res.status, headers: res.headers });
    },
  };
}

/** CPU seconds (user + system) a process has used so far, from /proc (Linux). */
function cpuSeconds(pid: number): number {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return Number.NaN;
  }
}

const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;

async function main() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-bench-sync-"));
  const file = path.join(dir, "bench.db");
  let t = performance.now();
  const { db, leader, bandId, ids } = await seed(file);
  console.log(`seeded ${CHARTS} charts in ${((performance.now() - t) / 1000).toFixed(1)} s`);

  let child: ChildProcess | null = null;
  let server: http.Server | null = null;
  const base = `http://localhost:${PORT}`;
  let cookie = "";
  const built = fs.existsSync(path.join(root, distDir, "BUILD_ID"));
  if (built) {
    // BENCH_NODE_ARGS (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof") profiles the server process.
    const nodeArgs = (process.env.BENCH_NODE_ARGS ?? "").split(" ").filter(Boolean);
    child = spawn(process.execPath, [...nodeArgs, path.join(root, "node_modules/next/dist/bin/next"), "start", "-p", String(PORT)], {
      cwd: root,
      env: { ...process.env, PEDALPOINT_BENCH_FLOOR: dir, NEXT_DIST_DIR: distDir, DATABASE_PATH: file, NEXTAUTH_URL: base, NEXTAUTH_SECRET: "bench-only-secret", NODE_ENV: "production" },
      stdio: "ignore",
    });
    if (!(await waitFor(`${base}/api/health`, child))) throw new Error("the Next server did not start");
    cookie = await signIn(base, leader.email);
    console.log(`target: the Next route (${distDir}) on ${base}`);
  } else {
    server = bareServer(db, leader).listen(PORT);
    console.log(`target: no Next build in ${distDir}; a bare node:http server around the same pull code on ${base}`);
  }

  try {
    // First sync, as a new device: every page into a local book.
    const count = { bytes: 0, requests: 0 };
    const book = new LocalBook(`bench-${randomUUID()}`, { indexedDB, IDBKeyRange });
    const engine = new SyncEngine({ book: () => book, transport: deviceTransport(base, cookie, count) });
    t = performance.now();
    await engine.sync();
    const first = performance.now() - t;
    if (engine.getSnapshot().problem) throw new Error(`first sync failed: ${engine.getSnapshot().error}`);
    const got = await book.charts.count();
    console.log(`first sync: ${got} charts in ${first.toFixed(0)} ms (target ≤ 1000 ms), ${kb(count.bytes)} in ${count.requests} requests (incl. writing to fake-indexeddb)`);

    // Delta after one changed chart.
    const one = ids[Math.floor(ids.length / 2)]!;
    await updateChart(db, leader, bandId, one, { title: "Bench Tune changed", composer: "Bench", key: "F", meter: "4/4", tempo: 160, feel: "up", sourceText: chartText(99999), message: "bench", baseRevision: 1 });
    const full = count.bytes;
    count.bytes = 0;
    count.requests = 0;
    t = performance.now();
    await engine.sync();
    const delta = performance.now() - t;
    console.log(`delta sync: ${delta.toFixed(0)} ms, ${kb(count.bytes)} in ${count.requests} requests = 1/${Math.round(full / Math.max(1, count.bytes))} of the full download (target ≤ 1/100)`);
    const row = await book.charts.get(one);
    if (row?.revision !== 2) throw new Error("the delta did not bring the change");

    // Pulls per second: a page of 50 changes and an empty poll, each beside its floor.
    const url = `${base}/api/bands/${bandId}/sync?since=0&limit=50`;
    const auth: Record<string, string> = cookie ? { cookie } : {};
    if (child) {
      fs.writeFileSync(path.join(dir, "page.json"), await (await fetch(url, { headers: auth })).text());
      const head = (await db.selectFrom("changes").select((eb) => eb.fn.max("seq").as("head")).executeTakeFirstOrThrow()).head;
      // What a device sends when it is up to date: its cursor, scope and the first page's count.
      const poll = `${base}/api/bands/${bandId}/sync?since=${head}&limit=200&scope=leader&count=1`;
      const gz = { "accept-encoding": "gzip" };
      const cpuBefore = cpuSeconds(child.pid!);
      await measureRatios(
        [
          { name: "pull, page of 50 changes", target: 0.7, route: { url, headers: auth }, floor: { url: `${base}/api/bench/floor?body=page`, headers: {} } },
          { name: "pull, page of 50, gzip", target: 0.7, route: { url, headers: { ...auth, ...gz } }, floor: { url: `${base}/api/bench/floor?body=page`, headers: gz } },
          { name: "pull, nothing new", target: 0.9, route: { url: poll, headers: auth }, floor: { url: `${base}/api/bench/floor?body=ok`, headers: {} } },
        ],
        ROUNDS,
        SECONDS,
      );
      console.log(`(server CPU over the ratio runs: ${(cpuSeconds(child.pid!) - cpuBefore).toFixed(1)} s)`);
    } else {
      console.log("ratios need the Next build (the floor route lives in it): skipped");
    }

    // In-process, for comparison (no HTTP, no session check).
    const end = performance.now() + 2000;
    const cpu0 = process.cpuUsage();
    let n = 0;
    while (performance.now() < end) {
      await pullChanges(db, leader, bandId, { since: 0, limit: 50 });
      n++;
    }
    const cpu1 = process.cpuUsage(cpu0);
    const perPage = (cpu1.user + cpu1.system) / 1e6 / n;
    console.log(`in-process pullChanges: ${Math.round(n / 2)} pages of 50 per second (${(perPage * 1000).toFixed(2)} ms CPU each = ${Math.round(1 / perPage)}/s per core)`);
  } finally {
    child?.kill("SIGTERM");
    server?.close();
    await db.destroy();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

await main();
