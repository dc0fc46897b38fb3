// The sync route against its floor, for scripts/bench/sync.ts: each case is a pair (the route, a bare
// route in the same process answering the same bytes), run in alternating rounds so both see the same
// share of a machine other people are using; the printed figure is the median of the rounds.
import { createRequire } from "node:module";

interface CannonResult {
  requests: { average: number };
  latency: { p50: number; p99: number };
  throughput: { average: number };
  non2xx: number;
  errors: number;
}
// autocannon ships no types; this is the part used here.
const autocannon = createRequire(import.meta.url)("autocannon") as (o: {
  url: string;
  connections: number;
  duration: number;
  headers: Record<string, string>;
}) => Promise<CannonResult>;

export interface Case {
  name: string;
  target: number;
  route: { url: string; headers: Record<string, string> };
  floor: { url: string; headers: Record<string, string> };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? Number.NaN;

async function rate(url: string, headers: Record<string, string>, seconds: number) {
  const r = await autocannon({ url, connections: 10, duration: seconds, headers });
  if (r.non2xx || r.errors) throw new Error(`${url}: ${r.non2xx} non-2xx, ${r.errors} errors`);
  return { rps: r.requests.average, bytesPerReq: r.throughput.average / Math.max(1, r.requests.average), p50: r.latency.p50 };
}

/** Runs every case `rounds` times, route and floor back to back (order flipped each round). */
export async function measureRatios(cases: Case[], rounds: number, seconds: number): Promise<void> {
  for (const c of cases) {
    const route: number[] = [];
    const floor: number[] = [];
    const ratio: number[] = [];
    let size = 0;
    for (let i = 0; i < rounds; i++) {
      const pair = i % 2 === 0 ? [c.route, c.floor] : [c.floor, c.route];
      const [a, b] = [await rate(pair[0]!.url, pair[0]!.headers, seconds), await rate(pair[1]!.url, pair[1]!.headers, seconds)];
      const [r, f] = i % 2 === 0 ? [a, b] : [b, a];
      route.push(r.rps);
      floor.push(f.rps);
      ratio.push(r.rps / f.rps);
      size = r.bytesPerReq;
    }
    const m = median(ratio);
    console.log(
      `${c.name}: ${Math.round(median(route))} req/s vs floor ${Math.round(median(floor))} req/s = ${m.toFixed(2)}× ` +
        `(target ≥ ${c.target}×, ${m >= c.target ? "met" : "MISSED"}; ~${(size / 1024).toFixed(1)} KB a response; ` +
        `rounds ${ratio.map((x) => x.toFixed(2)).join(", ")})`,
    );
  }
}
