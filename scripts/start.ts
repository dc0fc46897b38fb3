// `npm start`: migrate, optionally reset and seed, start the local fakes when asked, then run Next.
//   --fresh  delete the database file (and DATA_DIR) first      --seed  add the demo band
//   --dev    run `next dev` instead of `next start`
// Env: PORT (3000), DATABASE_PATH, DATA_DIR, MAIL_FAKE=1 (SMTP_PORT, MAIL_FAKE_HTTP_PORT),
//      PAYMENT_FAKE=1 (PAYMENT_FAKE_PORT), PUSH_FAKE=1 (PUSH_FAKE_PORT), NEXTAUTH_URL, NEXTAUTH_SECRET.
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { databasePath, migrateToLatest, openDatabase } from "../db/connection";
import { demoAccountsTable, seedDemo, DEMO_BAND_ID } from "../db/seed";
import { removeStaleUploads } from "../lib/server/stale-uploads";
import { startMailFake } from "./mail-fake";
import { startPushFake } from "./push-fake";

export interface StartFlags {
  fresh?: boolean;
  seed?: boolean;
  dev?: boolean;
}

interface Closable {
  name: string;
  close: () => unknown;
}

const root = process.cwd();

function removeFresh(): void {
  const db = databasePath();
  for (const f of [db, `${db}-wal`, `${db}-shm`]) fs.rmSync(f, { force: true });
  const dataDir = process.env.DATA_DIR;
  if (dataDir) {
    const abs = path.resolve(root, dataDir);
    // Only ever a folder inside the project, never the project itself.
    if (abs.startsWith(root + path.sep)) fs.rmSync(abs, { recursive: true, force: true });
    else console.warn(`not deleting DATA_DIR ${abs}: it is outside ${root}`);
  }
  console.log(`fresh start: removed ${path.relative(root, db)}${dataDir ? ` and ${dataDir}` : ""}`);
}

async function prepareDatabase(flags: StartFlags): Promise<void> {
  const db = openDatabase();
  try {
    const applied = await migrateToLatest(db);
    if (applied.length) console.log(`migrated ${path.relative(root, databasePath())}: ${applied.join(", ")}`);
    if (flags.seed) {
      const r = await seedDemo(db);
      console.log(`demo band ready (${r.usersCreated} new accounts, ${r.chartsCreated} new charts)`);
    }
  } finally {
    await db.destroy();
  }
}

async function startFakes(): Promise<Closable[]> {
  const fakes: Closable[] = [];
  if (process.env.MAIL_FAKE === "1") {
    const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
    const httpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526);
    const mail = await startMailFake({ smtpPort, httpPort });
    process.env.SMTP_HOST ??= "localhost";
    process.env.SMTP_PORT = String(mail.smtpPort);
    process.env.MAIL_FAKE_HTTP_PORT = String(mail.httpPort);
    console.log(`mail fake: SMTP on ${mail.smtpPort}, captured mail at http://localhost:${mail.httpPort}/messages`);
    fakes.push({ name: "mail fake", close: mail.close });
  }
  if (process.env.PAYMENT_FAKE === "1") {
    const file = path.join(import.meta.dirname, "payment-fake.ts");
    if (fs.existsSync(file)) {
      const mod = (await import(pathToFileURL(file).href)) as {
        startPaymentFake?: (o: { port: number }) => Promise<{ close?: () => unknown } | undefined>;
      };
      const port = Number(process.env.PAYMENT_FAKE_PORT ?? 2527);
      const fake = await mod.startPaymentFake?.({ port });
      process.env.PAYMENT_FAKE_PORT = String(port);
      console.log(`payment fake on port ${port}`);
      if (fake?.close) fakes.push({ name: "payment fake", close: () => fake.close?.() });
    } else {
      console.warn("PAYMENT_FAKE=1 but scripts/payment-fake.ts is missing; payments are off");
    }
  }
  if (process.env.PUSH_FAKE === "1") {
    const push = await startPushFake({ port: Number(process.env.PUSH_FAKE_PORT ?? 2528) });
    process.env.PUSH_FAKE_PORT = String(push.port);
    // The one plain-http push endpoint the server will send to (lib/server/push-subscriptions.ts).
    process.env.PUSH_FAKE_ORIGIN = push.origin;
    console.log(`push fake on ${push.origin}, received pushes at ${push.origin}/messages`);
    fakes.push({ name: "push fake", close: push.close });
  }
  return fakes;
}

async function waitForHealth(url: string, child: ChildProcess): Promise<boolean> {
  for (let i = 0; i < 600 && child.exitCode === null; i++) {
    try {
      const r = await fetch(url);
      if (r.ok) return true;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

function banner(url: string, seeded: boolean): void {
  const lines = [``, `Pedalpoint is running at ${url}`];
  if (seeded) {
    lines.push(`The demo band's library: ${url}/bands/${DEMO_BAND_ID}`, ``, `Demo accounts:`, demoAccountsTable());
  }
  if (process.env.MAIL_FAKE === "1") {
    // The key opens the whole captured box (sign-in links included): it is printed here only.
    lines.push(``, `Captured mail (all of it, keep this address to yourself): ${url}/dev/mail?key=${process.env.MAIL_VIEW_KEY}`);
  }
  console.log(lines.join("\n") + "\n");
}

export async function runStart(flags: StartFlags): Promise<void> {
  const port = Number(process.env.PORT ?? 3000);
  process.env.PORT = String(port);
  process.env.NEXTAUTH_URL ??= `http://localhost:${port}`;
  if (!process.env.NEXTAUTH_SECRET) {
    process.env.NEXTAUTH_SECRET = randomBytes(32).toString("base64url");
    console.warn("NEXTAUTH_SECRET is not set: using a random one, so sign-ins end when the server restarts.");
  }
  if (process.env.MAIL_FAKE === "1") process.env.MAIL_VIEW_KEY ??= randomBytes(18).toString("base64url");
  if (flags.fresh) removeFresh();
  await prepareDatabase(flags);
  const stale = removeStaleUploads(path.resolve(root, process.env.DATA_DIR ?? "data"));
  if (stale) console.log(`removed ${stale} unfinished upload file(s) left by an earlier stop`);
  const fakes = await startFakes();

  const nextBin = path.join(root, "node_modules", ".bin", "next");
  // A keep-alive longer than clients' idle reuse, so a reused socket is never closed under a request.
  const args = flags.dev ? ["dev", "-p", String(port)] : ["start", "-p", String(port), "--keepAliveTimeout", "65000"];
  const child = spawn(nextBin, args, { stdio: "inherit", env: process.env });

  let closing = false;
  const shutdown = async (code: number) => {
    if (closing) return;
    closing = true;
    if (child.exitCode === null) child.kill("SIGTERM");
    await Promise.allSettled(fakes.map(async (f) => f.close()));
    process.exit(code);
  };
  child.on("exit", (code, signal) => void shutdown(code ?? (signal ? 0 : 1)));
  for (const sig of ["SIGINT", "SIGTERM"] as const) process.on(sig, () => void shutdown(0));

  const url = process.env.NEXTAUTH_URL;
  if (await waitForHealth(`http://localhost:${port}/api/health`, child)) banner(url, Boolean(flags.seed));
}

function flagsFrom(argv: string[]): StartFlags {
  return { fresh: argv.includes("--fresh"), seed: argv.includes("--seed"), dev: argv.includes("--dev") };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runStart(flagsFrom(process.argv.slice(2))).catch((err: unknown) => {
    console.error(err);
    process.exit(1);
  });
}
