// Scale-out benchmark (issue 14). Prints sync pull and push throughput through the round-robin proxy
// on SQLite and on PostgreSQL, with one and with two `next start` processes of the build
// (scripts/scale-servers.ts): pull = a page of 50 changes, push = one new chart per request.
// Figures only, nothing asserted. The machine is shared: read the ratios, not the absolute numbers.
// Needs the production build and, for the PostgreSQL rows, PostgreSQL installed (else it says so).
// Env: BENCH_SCALE_PORT (3430; uses it and the next 3, and a free port after for PostgreSQL),
//      BENCH_SECONDS (5), BENCH_CHARTS (200), BENCH_CONNECTIONS (10).
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import { createRequire } from "node:module";
import os from "node:os";
import path from "node:path";
import { rerunWithServerOnlyStub } from "./server-only-hook";

rerunWithServerOnlyStub();

const { freePort, startCluster } = await import("../pg-cluster");
const { chartInput, hasBuild, seedBand, signIn, startFleet } = await import("../scale-servers");
const { createChart } = await import("../../lib/server/charts");

const PORT = Number(process.env.BENCH_SCALE_PORT ?? 3430);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CHARTS = Number(process.env.BENCH_CHARTS ?? 200);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 10);

interface CannonRequest {
  method?: string;
  body?: string;
  headers?: Record<string, string>;
}
interface CannonResult {
  requests: { average: number };
  latency: { p50: number; p99: number };
  non2xx: number;
  errors: number;
}
// autocannon ships no types; this is the part used here.
const autocannon = createRequire(import.meta.url)("autocannon") as (o: {
  url: string;
  connections: number;
  duration: number;
  method?: string;
  headers: Record<string, string>;
  requests?: { setupRequest: (req: CannonRequest) => CannonRequest }[];
}) => Promise<CannonResult>;

interface Row {
  engine: string;
  processes: number;
  pull: CannonResult;
  push: CannonResult;
}

async function measure(engine: string, target: string, processes: number): Promise<Row> {
  const fleet = await startFleet({ target, port: PORT, processes });
  try {
    const { bandId, leader } = await seedBand(fleet.db, "bench");
    for (let i = 0; i < CHARTS; i++) await createChart(fleet.db, leader, bandId, chartInput(`Bench Harbour ${i}`, i));
    const cookie = await signIn(fleet.proxy, leader.email);
    const url = `${fleet.proxy}/api/bands/${bandId}/sync`;
    const pull = await autocannon({ url: `${url}?since=0&limit=50`, connections: CONNECTIONS, duration: SECONDS, headers: { cookie } });
    let n = 0;
    const push = await autocannon({
      url,
      connections: CONNECTIONS,
      duration: SECONDS,
      method: "POST",
      headers: { cookie, "content-type": "application/json" },
      requests: [
        {
          setupRequest: (req) => {
            const mutation = { mutationId: randomUUID(), entity: "chart", id: randomUUID(), op: "upsert", baseRevision: null, data: chartInput(`Bench Push ${++n}`, n) };
            return { ...req, method: "POST", body: JSON.stringify({ mutations: [mutation] }) };
          },
        },
      ],
    });
    for (const [what, r] of [["pull", pull], ["push", push]] as const) {
      if (r.non2xx || r.errors) console.log(`  (${engine}, ${processes} process(es), ${what}: ${r.non2xx} non-2xx answers, ${r.errors} errors)`);
    }
    return { engine, processes, pull, push };
  } finally {
    await fleet.stop();
  }
}

function print(rows: Row[]): void {
  console.log(`\nsync through a round-robin proxy, ${CONNECTIONS} connections, ${SECONDS} s each, ${os.cpus().length} cores shared:`);
  console.log("engine      processes  pull pages/s (p50 ms)   pushes/s (p50 ms)");
  for (const r of rows) {
    const cell = (c: CannonResult) => `${c.requests.average.toFixed(0).padStart(6)} (${String(c.latency.p50).padStart(4)})`;
    console.log(`${r.engine.padEnd(11)} ${String(r.processes).padStart(9)}  ${cell(r.pull).padEnd(22)}  ${cell(r.push)}`);
  }
  for (const engine of new Set(rows.map((r) => r.engine))) {
    const [one, two] = [1, 2].map((p) => rows.find((r) => r.engine === engine && r.processes === p));
    if (one && two) {
      console.log(`${engine}: 2 processes / 1 process = pull ×${(two.pull.requests.average / one.pull.requests.average).toFixed(2)}, push ×${(two.push.requests.average / one.push.requests.average).toFixed(2)}`);
    }
  }
}

async function main(): Promise<void> {
  if (!hasBuild()) {
    console.log("no production build in .next: run `npm run build` first (skipped)");
    return;
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-bench-scale-"));
  const rows: Row[] = [];
  try {
    for (const processes of [1, 2]) rows.push(await measure("SQLite", path.join(dir, `scale-${processes}.db`), processes));
    let cluster: Awaited<ReturnType<typeof startCluster>> | null = null;
    try {
      cluster = await startCluster({ port: await freePort(PORT + 5) });
    } catch (err) {
      console.log(`PostgreSQL rows skipped: ${(err as Error).message}`);
    }
    if (cluster) {
      try {
        // One database per run, so the second run starts from an empty feed as the first did.
        for (const processes of [1, 2]) rows.push(await measure("PostgreSQL", await freshDatabase(cluster.url, `scale${processes}`), processes));
      } finally {
        cluster.stop();
      }
    }
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
  print(rows);
}

/** Creates database `name` on the cluster and returns its URL. */
async function freshDatabase(url: string, name: string): Promise<string> {
  const pg = (await import("pg")).default;
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(`create database ${name}`);
  } finally {
    await client.end();
  }
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

await main();
