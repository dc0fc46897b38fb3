// `npm run test:scale`: two `next start` processes of one build on one database behind a round-robin
// proxy behave as one server (issue 14). Run once on a SQLite file and once on a throwaway PostgreSQL
// cluster (scripts/pg-cluster.ts; skipped with a notice when PostgreSQL is not installed), with parts
// on a fake S3 store (s3rver). Checks:
//   - a multi-device sync simulation through the proxy: every device ends with every chart exactly
//     once and equal to the server, cursors and revisions never go backwards, no applied edit is lost;
//   - a session made on one process works on the other, and ending it on one ends it on both;
//   - a rate limit counts the requests of both processes together;
//   - a tune called through one process reaches an SSE follower connected to the other;
//   - a part uploaded through one process downloads through the other (S3).
// Needs the production build (`npm run build`). Env: SCALE_PORT (3410; uses it and the next 6).
import assert from "node:assert/strict";
import { spawn, type ChildProcess } from "node:child_process";
import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { rerunWithServerOnlyStub } from "./bench/server-only-hook";

rerunWithServerOnlyStub();

const { freePort, startCluster } = await import("./pg-cluster");
const { chartInput, hasBuild, seedBand, signIn, startFleet } = await import("./scale-servers");
const { createSetlist } = await import("../lib/server/setlists");
const { createChart } = await import("../lib/server/charts");
const { makePdf } = await import("../tests/unit/attachments/make-pdf");
type Fleet = Awaited<ReturnType<typeof startFleet>>;
type Member = Awaited<ReturnType<typeof seedBand>>["leader"];

const BASE_PORT = Number(process.env.SCALE_PORT ?? 3410);

/** mulberry32: a seeded generator, so a failing run can be replayed by its seed. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface LocalChart {
  revision: number;
  feel: string;
}

interface PullPage {
  seq: number;
  more: boolean;
  changes: { entity: string; id: string; op: string; data?: { revision: number; feel: string } }[];
}

interface PushResult {
  mutationId: string;
  status: "applied" | "conflict" | "rejected";
  revision?: number;
  current?: { revision: number; feel: string } | null;
  reason?: string;
}

/** A device: its local copy of the charts and its cursor, talking to the proxy only. */
class Device {
  readonly charts = new Map<string, LocalChart>();
  cursor = 0;
  constructor(
    readonly name: string,
    private readonly base: string,
    private readonly bandId: string,
    private readonly cookie: string,
  ) {}

  private url(rest: string): string {
    return `${this.base}/api/bands/${this.bandId}/sync${rest}`;
  }

  /** Pulls until the feed has no more; asserts the cursor and every chart's revision only go forward. */
  async pull(): Promise<void> {
    for (;;) {
      const res = await fetch(this.url(`?since=${this.cursor}&limit=7`), { headers: { cookie: this.cookie } });
      assert.equal(res.status, 200, `${this.name} pull answered ${res.status}`);
      const page = (await res.json()) as PullPage;
      assert.ok(page.seq >= this.cursor, `${this.name}: cursor went back from ${this.cursor} to ${page.seq}`);
      const seen = new Set<string>();
      for (const c of page.changes.filter((x) => x.entity === "chart")) {
        assert.ok(!seen.has(c.id), `${this.name}: chart ${c.id} twice in one page`);
        seen.add(c.id);
        const had = this.charts.get(c.id);
        if (c.op === "delete" || !c.data) continue;
        assert.ok(!had || c.data.revision >= had.revision, `${this.name}: chart revision went back from ${had?.revision} to ${c.data.revision}`);
        this.charts.set(c.id, { revision: c.data.revision, feel: c.data.feel });
      }
      this.cursor = page.seq;
      if (!page.more) return;
    }
  }

  /** Sends one edit of `chartId` on the revision it holds; `copies` sends of the same mutation (duplicates). */
  async edit(chartId: string, n: number, copies: number): Promise<PushResult> {
    const base = this.charts.get(chartId);
    const mutation = { mutationId: randomUUID(), entity: "chart", id: chartId, op: "upsert", baseRevision: base?.revision ?? null, data: chartInput("Harbour Lights", n) };
    let first: PushResult | null = null;
    for (let i = 0; i < copies; i++) {
      const res = await fetch(this.url(""), { method: "POST", headers: { cookie: this.cookie, "content-type": "application/json" }, body: JSON.stringify({ mutations: [mutation] }) });
      assert.equal(res.status, 200, `${this.name} push answered ${res.status}`);
      const r = ((await res.json()) as { results: PushResult[] }).results[0] as PushResult;
      first ??= r;
    }
    const r = first as PushResult;
    if (r.status === "conflict" && r.current) this.charts.set(chartId, { revision: r.current.revision, feel: r.current.feel });
    return r;
  }
}

async function syncSimulation(fleet: Fleet, bandId: string, leader: Member, cookie: string): Promise<void> {
  const rand = rng(14);
  const charts: string[] = [];
  for (let i = 0; i < 4; i++) charts.push((await createChart(fleet.db, leader, bandId, chartInput(`Harbour Lights ${i}`, i))).id);
  const devices = Array.from({ length: 4 }, (_, i) => new Device(`device ${i + 1}`, fleet.proxy, bandId, cookie));
  // Every revision an applied edit made, per chart: together they must be every revision after the first.
  const applied = new Map<string, Set<number>>(charts.map((id) => [id, new Set<number>()]));
  let edits = 0;
  for (let round = 0; round < 12; round++) {
    await Promise.all(
      devices.map(async (d, i) => {
        if (rand() < 0.25) return; // an offline spell: this device sits the round out
        for (let k = 0; k < 3; k++) {
          const chartId = charts[Math.floor(rand() * charts.length)] as string;
          const r = await d.edit(chartId, round * 100 + i * 10 + k, rand() < 0.2 ? 2 : 1);
          assert.notEqual(r.status, "rejected", `${d.name}: edit refused: ${r.reason}`);
          if (r.status === "applied") applied.get(chartId)?.add(r.revision as number);
          edits++;
        }
        if (rand() < 0.7) await d.pull();
      }),
    );
  }
  await Promise.all(devices.map((d) => d.pull()));
  const server = await fleet.db.selectFrom("charts").select(["id", "revision", "feel"]).where("band_id", "=", bandId).execute();
  for (const row of server) {
    const revs = applied.get(row.id) as Set<number>;
    assert.deepEqual([...revs].sort((a, b) => a - b), Array.from({ length: row.revision - 1 }, (_, i) => i + 2), `chart ${row.id}: an applied edit is missing`);
    for (const d of devices) assert.deepEqual(d.charts.get(row.id), { revision: row.revision, feel: row.feel }, `${d.name} differs from the server on ${row.id}`);
  }
  for (const d of devices) assert.equal(d.charts.size, server.length, `${d.name} holds ${d.charts.size} charts, the server ${server.length}`);
  const total = server.reduce((n, r) => n + r.revision - 1, 0);
  console.log(`  sync: 4 devices, ${edits} edits sent (${total} applied, the rest conflicts), all devices equal to the server`);
}

async function sessions(fleet: Fleet, email: string): Promise<void> {
  const [a, b] = fleet.direct as [string, string];
  const cookie = await signIn(a, email);
  const me = await fetch(`${b}/api/me/bootstrap`, { headers: { cookie } });
  assert.equal(me.status, 200, "a session made on process A is refused by process B");
  const end = await fetch(`${b}/api/auth/sign-out-everywhere`, { method: "POST", headers: { cookie } });
  assert.ok(end.ok, `signing out everywhere on B answered ${end.status}`);
  const after = await fetch(`${a}/api/me/bootstrap`, { headers: { cookie } });
  assert.equal(after.status, 401, "a session ended on process B still works on process A");
  console.log("  sessions: made on A, used on B; ended on B, refused on A");
}

async function rateLimit(fleet: Fleet): Promise<void> {
  // Sign-ups: 5 per client per hour (lib/server/rate-limit.ts). Alternating through the proxy, each
  // process sees only 3; if each counted alone, none would be refused.
  const statuses: number[] = [];
  for (let i = 0; i < 6; i++) {
    const res = await fetch(`${fleet.proxy}/api/signup`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ name: `Newcomer ${i}`, email: `newcomer-${i}-${randomUUID().slice(0, 8)}@scale.test`, password: `pp-newcomer-${randomUUID()}` }),
    });
    statuses.push(res.status);
  }
  assert.deepEqual(statuses, [201, 201, 201, 201, 201, 429], "the sign-up limit does not count across both processes");
  console.log(`  rate limit: sign-ups through both processes ${statuses.join(", ")}`);
}

/** Reads an SSE response until an event whose data contains `needle`, or fails after `ms`. */
async function awaitEvent(res: Response, needle: string, ms: number): Promise<string> {
  const reader = (res.body as ReadableStream<Uint8Array>).getReader();
  const decoder = new TextDecoder();
  let text = "";
  const timer = setTimeout(() => void reader.cancel(), ms);
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) throw new Error(`no event with ${needle} within ${ms} ms; got: ${text.slice(-500)}`);
      text += decoder.decode(value, { stream: true });
      const hit = text.split("\n\n").find((e) => e.includes("data:") && e.includes(needle));
      if (hit) return hit;
    }
  } finally {
    clearTimeout(timer);
    await reader.cancel().catch(() => undefined);
  }
}

async function calls(fleet: Fleet, bandId: string, leader: Member, cookie: string): Promise<void> {
  const [a, b] = fleet.direct as [string, string];
  const chart = await createChart(fleet.db, leader, bandId, chartInput("Lantern Walk", 1));
  const entryId = randomUUID();
  const setlist = await createSetlist(fleet.db, leader, bandId, { name: "Pier Pavilion, Friday", entries: [{ id: entryId, chartId: chart.id, setNumber: 1, position: 0 }] });
  const base = `/api/bands/${bandId}/setlists/${setlist.id}/calls`;
  const follower = await fetch(`${b}${base}/stream`, { headers: { cookie, accept: "text/event-stream" } });
  assert.equal(follower.status, 200, `the call stream on B answered ${follower.status}`);
  const heard = awaitEvent(follower, entryId, 15_000);
  const call = await fetch(`${a}${base}`, { method: "POST", headers: { cookie, "content-type": "application/json" }, body: JSON.stringify({ entryId }) });
  assert.equal(call.status, 200, `calling the tune on A answered ${call.status}: ${await call.clone().text()}`);
  await heard;
  console.log("  calls: a tune called on A reached the follower on B");
}

async function parts(fleet: Fleet, bandId: string, leader: Member, cookie: string): Promise<void> {
  const [a, b] = fleet.direct as [string, string];
  const chart = await createChart(fleet.db, leader, bandId, chartInput("Tidewater", 2));
  const pdf = makePdf(2);
  const form = new FormData();
  form.append("file", new Blob([new Uint8Array(pdf)], { type: "application/pdf" }), "tidewater-bb.pdf");
  const up = await fetch(`${a}/api/bands/${bandId}/charts/${chart.id}/attachments`, { method: "POST", headers: { cookie }, body: form });
  assert.equal(up.status, 201, `upload on A answered ${up.status}: ${await up.clone().text()}`);
  const { attachment } = (await up.json()) as { attachment: { id: string; sha256: string } };
  const down = await fetch(`${b}/api/bands/${bandId}/charts/${chart.id}/attachments/${attachment.id}`, { headers: { cookie } });
  assert.equal(down.status, 200, `download on B answered ${down.status}`);
  const bytes = new Uint8Array(await down.arrayBuffer());
  assert.equal(createHash("sha256").update(bytes).digest("hex"), createHash("sha256").update(pdf).digest("hex"), "B served other bytes than A stored");
  const row = await fleet.db.selectFrom("attachments").select("path").where("id", "=", attachment.id).executeTakeFirstOrThrow();
  assert.equal(row.path, `attachments/${attachment.sha256}`);
  console.log(`  parts: ${bytes.byteLength} bytes uploaded on A, the same bytes downloaded on B, from the fake S3 store`);
}

// s3rver in its own process, with its documented fixed credentials.
const S3_FAKE = `const { default: S3rver } = await import("s3rver");
const [port, directory] = process.argv.slice(1);
await new S3rver({ address: "127.0.0.1", port: Number(port), silent: true, directory, configureBuckets: [{ name: "parts", configs: [] }] }).run();
console.log("ready");`;

async function startS3(port: number, dir: string): Promise<{ env: Record<string, string>; child: ChildProcess }> {
  const child = spawn(process.execPath, ["--input-type=module", "-e", S3_FAKE, String(port), dir], { stdio: ["ignore", "pipe", "inherit"] });
  await new Promise<void>((resolve, reject) => {
    child.stdout?.on("data", (d: Buffer) => d.toString().includes("ready") && resolve());
    child.once("exit", (code) => reject(new Error(`fake S3 exited with ${code}`)));
  });
  const env = { S3_ENDPOINT: `http://127.0.0.1:${port}`, S3_BUCKET: "parts", S3_REGION: "us-east-1", AWS_ACCESS_KEY_ID: "S3RVER", AWS_SECRET_ACCESS_KEY: "S3RVER" };
  return { env, child };
}

async function runOn(label: string, target: string, s3env: Record<string, string>): Promise<void> {
  console.log(`two processes on ${label}:`);
  const t = performance.now();
  const fleet = await startFleet({ target, port: BASE_PORT, processes: 2, env: s3env });
  try {
    const { bandId, leader } = await seedBand(fleet.db, "scale");
    const cookie = await signIn(fleet.proxy, leader.email);
    await syncSimulation(fleet, bandId, leader, cookie);
    await calls(fleet, bandId, leader, cookie);
    await parts(fleet, bandId, leader, cookie);
    await rateLimit(fleet);
    await sessions(fleet, leader.email);
  } finally {
    await fleet.stop();
  }
  console.log(`  (${((performance.now() - t) / 1000).toFixed(1)} s)`);
}

async function main(): Promise<void> {
  if (!hasBuild()) throw new Error("no production build in .next: run `npm run build` first");
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-scale-"));
  const s3 = await startS3(await freePort(BASE_PORT + 5), path.join(dir, "s3"));
  try {
    await runOn("a SQLite file", path.join(dir, "scale.db"), s3.env);
    let cluster: Awaited<ReturnType<typeof startCluster>> | null = null;
    try {
      cluster = await startCluster({ port: await freePort(BASE_PORT + 6) });
    } catch (err) {
      if (process.env.CI) throw err;
      console.log(`PostgreSQL run skipped: ${(err as Error).message}`);
    }
    if (cluster) {
      try {
        await runOn("PostgreSQL", cluster.url, s3.env);
      } finally {
        cluster.stop();
      }
    }
  } finally {
    s3.child.kill();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

await main();
console.log("two-process checks passed");
