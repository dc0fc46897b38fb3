// `npm run test:pg`: the server test suite again, on a real PostgreSQL server. Starts a throwaway
// cluster (scripts/pg-cluster.ts), runs vitest with vitest.pg.config.ts against it, stops it.
// Extra arguments go to vitest (e.g. a test file).
import { spawnSync } from "node:child_process";
import { startCluster } from "./pg-cluster";

const cluster = await startCluster({ log: (s) => console.log(s) });
let status = 1;
try {
  const r = spawnSync("npx", ["vitest", "run", "--config", "vitest.pg.config.ts", ...process.argv.slice(2)], {
    stdio: "inherit",
    env: { ...process.env, PEDALPOINT_TEST_DATABASE_URL: cluster.url, DATABASE_URL: cluster.url, VITE_CONFIG_NATIVE_IGNORE_WARNING: "true" },
  });
  status = r.status ?? 1;
} finally {
  cluster.stop();
}
process.exit(status);
