// Chart-text safety benchmark (issue 10 item 1). Prints:
//   - the time to check a 50,000-line chart text and a 10 MB one (both refused by the size limits
//     before any parsing), and the time to parse the largest text the limits let through;
//   - the longest a concurrent request would wait on the event loop (the health check's wait)
//     while one sync push carries three such texts, for each kind. Target: under 100 ms.
// In-process against a real SQLite file: the wait is the event loop's longest stall, measured by
// a 1 ms timer (what a health check arriving meanwhile would sit behind).
import os from "node:os";
import path from "node:path";
import fs from "node:fs";
import { randomUUID } from "node:crypto";
import { performance } from "node:perf_hooks";
import { rerunWithServerOnlyStub } from "./server-only-hook";

rerunWithServerOnlyStub();

const { migrateToLatest, openDatabase } = await import("../../db/connection");
const { parseChartText } = await import("../../lib/chart");
const { prepareChart } = await import("../../lib/server/chart-body");
const { pushMutations } = await import("../../lib/server/sync");
const { MutationSchema } = await import("../../lib/offline/protocol");

const { MAX_CHART_TEXT_CHARS, MAX_CHART_TEXT_LINES } = await import("../../lib/chart");

const BARS_PER_SECTION = 512; // ChartSchema: at most 64 sections of 512 bars

/** Sections of full bars, one bar a line, until `lines` lines; then padded with spaces to exactly `chars`. */
function textAtLimit({ chars, lines }: { chars: number; lines: number }): string {
  const out: string[] = [];
  let section = 0;
  while (out.length < lines) {
    out.push(`S${++section}:`);
    for (let bar = 0; bar < BARS_PER_SECTION - 1 && out.length < lines; bar++) out.push("| Dm7 |");
  }
  const text = out.join("\n");
  if (text.length > chars) throw new Error(`bench text too long: ${text.length} > ${chars}`);
  return text + " ".repeat(chars - text.length);
}

const TEXTS = {
  "50,000 blank lines + one bar": `${"\n".repeat(50_000)}A:\n| C |`,
  "10 MB of bars": `A:\n${"| C7 ".repeat(2_000_000)}|`,
  "one section of 3,500 bars (bar limit)": `A:\n${Array.from({ length: 3_500 }, () => "| Dm7 G7 | C |").join("\n")}`.slice(0, 49_990),
  "exactly at the limits (50,000 chars, 5,000 lines)": textAtLimit({ chars: MAX_CHART_TEXT_CHARS, lines: MAX_CHART_TEXT_LINES }),
};

function timeCheck(text: string): { ms: number; outcome: string } {
  const t = performance.now();
  let outcome = "accepted";
  try {
    prepareChart({ title: "Bench", composer: "", key: "C", meter: "4/4", tempo: null, feel: "", sourceText: text });
  } catch (err) {
    outcome = `refused: ${(err as Error).message.slice(0, 60)}`;
  }
  return { ms: performance.now() - t, outcome };
}

/** Longest stall of a 1 ms timer while `work` runs. */
async function longestWait(work: () => Promise<unknown>): Promise<number> {
  let last = performance.now();
  let worst = 0;
  const timer = setInterval(() => {
    const now = performance.now();
    worst = Math.max(worst, now - last);
    last = now;
  }, 1);
  await work();
  clearInterval(timer);
  return worst;
}

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-bench-limits-"));
const db = openDatabase(path.join(dir, "bench.db"));
await migrateToLatest(db);
const leader = { userId: randomUUID(), email: "bench-leader@band.test", name: "Bench Leader" };
const bandId = randomUUID();
const now = new Date().toISOString();
await db.insertInto("users").values({ id: leader.userId, email: leader.email, name: leader.name, password_hash: null, default_instrument: "concert", created_at: now }).execute();
await db.insertInto("bands").values({ id: bandId, name: "Bench Band", city: null, created_by: leader.userId, created_at: now }).execute();
await db.insertInto("memberships").values({ band_id: bandId, user_id: leader.userId, role: "leader", instrument: "concert", expires_at: null, created_at: now }).execute();

parseChartText("title: warm\nkey: C\nA:\n| C |");
for (const text of Object.values(TEXTS)) timeCheck(text); // warm up: the figures are steady-state
console.log("chart text check (prepareChart, as the routes and sync call it):");
for (const [name, text] of Object.entries(TEXTS)) {
  const { ms, outcome } = timeCheck(text);
  console.log(`  ${name.padEnd(52)} ${ms.toFixed(2).padStart(9)} ms  ${outcome}`);
}
console.log("health-check wait while one push carries three such texts (target < 100 ms):");
for (const [name, text] of Object.entries(TEXTS)) {
  const mutations = [1, 2, 3].map((n) =>
    MutationSchema.parse({ mutationId: randomUUID(), entity: "chart", id: randomUUID(), data: { title: `Bench ${n}`, composer: "", key: "C", meter: "4/4", tempo: null, feel: "", sourceText: text, message: "" } }),
  );
  let statuses: string[] = [];
  const wait = await longestWait(async () => {
    statuses = (await pushMutations(db, leader, bandId, mutations)).results.map((r) => r.status);
  });
  console.log(`  ${name.padEnd(52)} ${wait.toFixed(1).padStart(9)} ms  (${statuses.join(", ")})`);
}
// The chart editor checks the text in the browser's main thread once typing settles (300 ms): one
// check of a 5,000-line paste is the longest the tab can be busy with it (the browser test
// tests/e2e/security.spec.ts proves the page still answers meanwhile).
const { composeText, placeProblem } = await import("../../components/library/chart-form-model");
const { ChartTextError } = await import("../../lib/chart");
const pasted = Array.from({ length: 4_990 }, (_, i) => (i % 400 === 0 ? `S${i / 400 + 1}:` : "| C7 F7 |")).join("\n");
const form = { title: "Bench", composer: "", key: "C", meter: "4/4", tempo: "", feel: "", sourceText: pasted, message: "" };
function editorCheck(): number {
  const t = performance.now();
  const composed = composeText(form);
  try {
    parseChartText(composed.text);
  } catch (err) {
    if (err instanceof ChartTextError) placeProblem(composed, { line: err.line, column: err.column, message: err.message });
  }
  return performance.now() - t;
}
for (let i = 0; i < 3; i++) editorCheck();
const editorRuns = Array.from({ length: 5 }, editorCheck).sort((a, b) => a - b);
console.log(`chart editor check of a 5,000-line paste (main thread, median of 5): ${editorRuns[2]!.toFixed(1)} ms`);
await db.destroy();
fs.rmSync(dir, { recursive: true, force: true });
