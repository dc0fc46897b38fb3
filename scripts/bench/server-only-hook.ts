// The server modules import "server-only" (provided by Next inside the app). Outside Next, a bench
// calls this first: it runs the same file again under a tiny loader hook that resolves "server-only"
// to an empty module, and exits with that run's status. Import server code only after it returns.
import { spawnSync } from "node:child_process";

const HOOK = `export async function resolve(s, c, next) { return s === "server-only" ? { url: "data:text/javascript,", shortCircuit: true } : next(s, c); }`;

export function rerunWithServerOnlyStub(): void {
  if (process.env.PEDALPOINT_BENCH_HOOKED) return;
  const register = `import { register } from "node:module"; register(${JSON.stringify(`data:text/javascript,${encodeURIComponent(HOOK)}`)});`;
  const r = spawnSync(process.execPath, ["--import", `data:text/javascript,${encodeURIComponent(register)}`, "--import", "tsx", ...process.argv.slice(1)], {
    stdio: "inherit",
    env: { ...process.env, PEDALPOINT_BENCH_HOOKED: "1" },
  });
  process.exit(r.status ?? 1);
}
