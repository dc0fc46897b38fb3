// Two app processes of one production build (.next) on one database, behind a plain round-robin
// proxy (node:http), for the two-process test (scripts/scale-test.ts) and its benchmark
// (scripts/bench/scale.ts). Import after rerunWithServerOnlyStub(): the seeding uses server code.
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import type { Kysely } from "kysely";
import { migrateToLatest, openDatabase } from "../db/connection";
import type { Database } from "../db/schema";
import { hashPassword } from "../lib/server/users";
import { signInWithPassword } from "./sign-in-client";

const root = path.resolve(import.meta.dirname, "..");
export const PASSWORD = "scale-only-password";

export interface Fleet {
  /** The proxy's address: requests alternate between the processes. */
  proxy: string;
  /** Each process's own address, for checks that must name the process. */
  direct: string[];
  db: Kysely<Database>;
  stop(): Promise<void>;
}

export interface FleetOptions {
  /** A SQLite file path or a postgres:// URL. */
  target: string;
  /** First of the ports used: the proxy on it, the processes on the next ones. */
  port: number;
  processes: number;
  /** Extra environment for the app processes (S3 settings). */
  env?: Record<string, string>;
}

/** A round-robin proxy: each request goes to the next upstream, X-Forwarded-For appended as a real proxy does. */
function roundRobin(upstreams: number[]): http.Server {
  let next = 0;
  return http.createServer((req, res) => {
    const port = upstreams[next++ % upstreams.length] as number;
    const forwarded = [req.headers["x-forwarded-for"], req.socket.remoteAddress].filter(Boolean).join(", ");
    const up = http.request({ host: "127.0.0.1", port, path: req.url, method: req.method, headers: { ...req.headers, "x-forwarded-for": forwarded } }, (r) => {
      res.writeHead(r.statusCode ?? 502, r.headers);
      r.pipe(res);
    });
    up.on("error", () => {
      if (!res.headersSent) res.writeHead(502);
      res.end();
    });
    req.pipe(up);
  });
}

async function healthy(url: string, child: ChildProcess): Promise<void> {
  for (let i = 0; i < 480 && child.exitCode === null; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app process behind ${url} did not start`);
}

function startApp(port: number, proxy: string, opts: FleetOptions, log: string): ChildProcess {
  const dbEnv = opts.target.startsWith("postgres") ? { DATABASE_URL: opts.target, DATABASE_POOL_SIZE: "5" } : { DATABASE_PATH: opts.target };
  const out = fs.openSync(log, "a");
  return spawn(process.execPath, [path.join(root, "node_modules/next/dist/bin/next"), "start", "-p", String(port)], {
    cwd: root,
    env: { ...process.env, ...dbEnv, ...opts.env, NEXTAUTH_URL: proxy, NEXTAUTH_SECRET: "scale-only-secret", NODE_ENV: "production", PORT: String(port) },
    stdio: ["ignore", out, out],
  });
}

export function hasBuild(): boolean {
  return fs.existsSync(path.join(root, ".next", "BUILD_ID"));
}

/** Migrates the target, starts the processes and the proxy. */
export async function startFleet(opts: FleetOptions): Promise<Fleet> {
  const db = openDatabase(opts.target);
  await migrateToLatest(db);
  const proxy = `http://127.0.0.1:${opts.port}`;
  const ports = Array.from({ length: opts.processes }, (_, i) => opts.port + 1 + i);
  const log = path.join(os.tmpdir(), `pedalpoint-scale-${opts.port}.log`);
  const children = ports.map((p) => startApp(p, proxy, opts, log));
  const server = roundRobin(ports);
  await new Promise<void>((resolve) => server.listen(opts.port, "127.0.0.1", resolve));
  try {
    await Promise.all(ports.map((p, i) => healthy(`http://127.0.0.1:${p}/api/health`, children[i] as ChildProcess)));
  } catch (err) {
    console.error(fs.readFileSync(log, "utf8").slice(-3000));
    throw err;
  }
  return {
    proxy,
    direct: ports.map((p) => `http://127.0.0.1:${p}`),
    db,
    async stop() {
      for (const c of children) c.kill("SIGTERM");
      await Promise.all(children.map((c) => (c.exitCode === null ? new Promise((r) => c.once("exit", r)) : null)));
      await new Promise((r) => server.close(r));
      server.closeAllConnections();
      await db.destroy();
    },
  };
}

export interface Member {
  userId: string;
  email: string;
  name: string;
}

/** An invented band with a leader on the band plan, written straight into the database. */
export async function seedBand(db: Kysely<Database>, label: string): Promise<{ bandId: string; leader: Member }> {
  const now = new Date().toISOString();
  const leader = { userId: randomUUID(), email: `${label}-${Date.now().toString(36)}@scale.test`, name: "Scale Leader" };
  await db.insertInto("users").values({ id: leader.userId, email: leader.email, name: leader.name, password_hash: await hashPassword(PASSWORD), default_instrument: "concert", created_at: now }).execute();
  const bandId = randomUUID();
  await db.insertInto("bands").values({ id: bandId, name: "The Lamplight Six", city: null, created_by: leader.userId, created_at: now }).execute();
  await db.insertInto("memberships").values({ band_id: bandId, user_id: leader.userId, role: "leader", instrument: "concert", expires_at: null, created_at: now }).execute();
  await db.insertInto("subscriptions").values({ band_id: bandId, plan: "band", status: "active", customer_id: null, subscription_id: null, current_period_end: null, cancel_at_period_end: 0, updated_at: now }).execute();
  return { bandId, leader };
}

/** Signs in through next-auth's password callback at `base`; returns the cookie header. */
export function signIn(base: string, email: string): Promise<string> {
  return signInWithPassword(base, email, PASSWORD);
}

/** An invented 8-bar chart text; `n` varies the changes so each edit says something new. */
export function chartText(n: number): string {
  const roots = ["F", "Bb", "Eb", "Ab", "Db", "G", "C"];
  const bars = Array.from({ length: 8 }, (_, b) => `${roots[(n + b) % roots.length]}${b % 2 ? "7" : "maj7"}`);
  return `title: Harbour Lights\nkey: F\ntime: 4/4\n\nA:\n| ${bars.slice(0, 4).join(" | ")} |\n| ${bars.slice(4).join(" | ")} |\n`;
}

export function chartInput(title: string, n: number) {
  return { title, composer: "Scale", key: "F", meter: "4/4", tempo: 132, feel: `take ${n}`, sourceText: chartText(n), message: "" };
}
