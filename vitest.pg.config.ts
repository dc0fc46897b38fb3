// The server tests that touch the database, run against PostgreSQL (`npm run test:pg`).
// A test file is in when it opens a database: through the server test helpers (freshDb), the set-list
// fixture (makeWorld), db/test-database, or the app's own handle (@/db). New database tests that use
// those are picked up without editing this list.
// (Imported without an extension for tsc; vite warns about that and still loads it.)
import fs from "node:fs";
import path from "node:path";
import { defineConfig } from "vitest/config";
import base from "./vitest.config";

const root = import.meta.dirname;
const TOUCHES_DB = /\bfreshDb\(|\bmakeWorld\(|db\/test-database|["']@\/db["']/;

function databaseTests(dir: string): string[] {
  const out: string[] = [];
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) out.push(...databaseTests(p));
    else if (/\.test\.tsx?$/.test(e.name) && TOUCHES_DB.test(fs.readFileSync(p, "utf8"))) out.push(path.relative(root, p));
  }
  return out.sort();
}

// Not mergeConfig: it would add this list to the base one instead of replacing it.
export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: databaseTests(path.join(root, "tests/unit")),
    // Two cores: a few files at a time keeps the server's connections and the CPU in bounds.
    maxWorkers: 2,
  },
});
