// `npm run bench`: runs every benchmark script under scripts/bench/ in turn and prints their figures.
// Each script measures and prints; none of them fails on a number (targets are read, not asserted).
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

const dir = path.join(import.meta.dirname, "bench");
const only = process.argv.slice(2);
const scripts = fs
  .readdirSync(dir)
  .filter((f) => f.endsWith(".ts") && !f.startsWith("_"))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

let failed = 0;
for (const file of scripts) {
  console.log(`\n=== ${file} ===`);
  const r = spawnSync(process.execPath, ["--import", "tsx", path.join(dir, file)], { stdio: "inherit", env: process.env });
  if (r.status !== 0) {
    failed++;
    console.log(`(${file} exited with ${r.status})`);
  }
}
process.exit(failed ? 1 : 0);
