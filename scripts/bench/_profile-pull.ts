// Profiles the pull path in-process (no HTTP): seeds a small book, then runs pullChanges for a page of
// 50 and for an empty poll under the V8 profiler and prints the heaviest functions by self time.
// Run: node --import tsx scripts/bench/_profile-pull.ts   (the server-only hook as in sync.ts)
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import inspector from "node:inspector/promises";
import os from "node:os";
import path from "node:path";
import { rerunWithServerOnlyStub } from "./server-only-hook";

rerunWithServerOnlyStub();

const { migrateToLatest, openDatabase } = await import("../../db/connection");
const { createChart } = await import("../../lib/server/charts");
const { pullChanges } = await import("../../lib/server/sync");

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-prof-"));
const db = openDatabase(path.join(dir, "p.db"));
await migrateToLatest(db);
const now = new Date().toISOString();
const leader = { userId: randomUUID(), email: "p@bench.test", name: "P" };
await db.insertInto("users").values({ id: leader.userId, email: leader.email, name: "P", password_hash: "x", default_instrument: "concert", created_at: now }).execute();
const bandId = randomUUID();
await db.insertInto("bands").values({ id: bandId, name: "Bench Band", city: null, created_by: leader.userId, created_at: now }).execute();
await db.insertInto("memberships").values({ band_id: bandId, user_id: leader.userId, role: "leader", instrument: "concert", expires_at: null, created_at: now }).execute();
await db.insertInto("subscriptions").values({ band_id: bandId, plan: "band", status: "active", customer_id: null, subscription_id: null, current_period_end: null, cancel_at_period_end: 0, updated_at: now }).execute();
const text = (i: number) => `title: T${i}\nkey: F\ntime: 4/4\n\nA:\n${"| Cm7 F7 | Fm7 Bb7 | Ebmaj7 | Ab7 |\n".repeat(8)}`;
for (let i = 0; i < 120; i++) await createChart(db, leader, bandId, { title: `T${i}`, composer: "B", key: "F", meter: "4/4", tempo: 144, feel: "swing", sourceText: text(i), message: "" });
const head = (await db.selectFrom("changes").select((eb) => eb.fn.max("seq").as("h")).executeTakeFirstOrThrow()).h;

const session = new inspector.Session();
session.connect();
for (const [name, q] of [["page of 50", { since: 0, limit: 50 }], ["empty poll", { since: Number(head), limit: 200, scope: "leader", count: "1" as const }]] as const) {
  for (let i = 0; i < 50; i++) await pullChanges(db, leader, bandId, q);
  await session.post("Profiler.enable");
  await session.post("Profiler.start");
  const t = performance.now();
  const n = 400;
  for (let i = 0; i < n; i++) await pullChanges(db, leader, bandId, q);
  const ms = (performance.now() - t) / n;
  const { profile } = await session.post("Profiler.stop");
  const self = new Map<string, number>();
  const dt = profile.timeDeltas ?? [];
  const byId = new Map(profile.nodes.map((nd) => [nd.id, nd]));
  (profile.samples ?? []).forEach((id, i) => {
    const nd = byId.get(id)!;
    const k = `${nd.callFrame.functionName || "(anon)"} ${path.basename(nd.callFrame.url)}:${nd.callFrame.lineNumber}`;
    self.set(k, (self.get(k) ?? 0) + (dt[i] ?? 0));
  });
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  console.log(`\n${name}: ${ms.toFixed(3)} ms each`);
  for (const [k, v] of [...self.entries()].sort((a, b) => b[1] - a[1]).slice(0, 14)) console.log(`  ${((100 * v) / total).toFixed(1).padStart(5)}%  ${k}`);
}
await db.destroy();
fs.rmSync(dir, { recursive: true, force: true });
