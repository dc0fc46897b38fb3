// `npm run demo`: build once if needed, then start with the demo band, the mail fake and the
// payment fake. `--dev` runs `next dev` instead (no build, no service worker); `--accounts` prints
// the demo accounts table and stops.
import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { demoAccountsTable } from "../db/seed";
import { runStart } from "./start";

// `npm run demo -- --accounts` prints the demo accounts as a Markdown table (for the README) and stops.
if (process.argv.includes("--accounts")) {
  console.log(demoAccountsTable());
  process.exit(0);
}

const dev = process.argv.includes("--dev");
const root = process.cwd();
const distDir = process.env.NEXT_DIST_DIR || ".next";

process.env.MAIL_FAKE = "1";
process.env.PAYMENT_FAKE = "1";
process.env.PUSH_FAKE ??= "1";
process.env.PORT ??= "3000";
process.env.NEXTAUTH_URL ??= `http://localhost:${process.env.PORT}`;

// One generated secret per checkout, kept in the (git-ignored) data folder so demo sign-ins
// survive a restart. It is for the local demo only.
if (!process.env.NEXTAUTH_SECRET) {
  const file = path.join(root, "data", "demo-secret");
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  }
  process.env.NEXTAUTH_SECRET = fs.readFileSync(file, "utf8").trim();
}

if (!dev && !fs.existsSync(path.join(root, distDir, "BUILD_ID"))) {
  console.log("No production build yet: running `npm run build` (about a minute) …");
  const r = spawnSync("npm", ["run", "build"], { stdio: "inherit", env: process.env });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

await runStart({ seed: true, dev });
