// Music-core benchmark: a generated 1,000-chart book through parse → analyse → intro → arrangement.
// Prints the cost per chart (median, p95, CPU time) and the total. Run: npx tsx scripts/bench/music.ts [charts]
import { performance } from "node:perf_hooks";
import { analyseTop, arrange, generateIntro, parseChartText, suggestIntros, INTRO_KINDS } from "@/lib/chart";
import { INSTRUMENT_IDS } from "@/lib/music";

const COUNT = Number(process.argv[2] ?? 1000);
const KEYS = ["C", "F", "Bb", "Eb", "Ab", "Db", "G", "D", "A", "E", "Cm", "Fm", "Gm", "Dm", "Am", "Bbm"];
const MAJOR_CELLS = ["Imaj7", "vi7", "ii7", "V7", "iii7", "VI7", "IVmaj7", "bVII7", "ii7 V7", "iiø7 V7(b9)", "I6/9", "bIImaj7", "V7alt", "IV7(#11)"];

// Deterministic pseudo-random numbers so every run measures the same book.
let seed = 12345;
const rand = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)]!;

const DEGREE: Record<string, number> = { I: 0, ii: 2, iii: 4, IV: 5, V: 7, vi: 9, VI: 9, bVII: 10, bII: 1 };
const NOTES = ["C", "Db", "D", "Eb", "E", "F", "Gb", "G", "Ab", "A", "Bb", "B"];

function realise(cell: string, tonicIndex: number): string {
  return cell
    .split(" ")
    .map((c) => {
      const m = /^(b?[IViv]+)(.*)$/.exec(c)!;
      const root = NOTES[(tonicIndex + (DEGREE[m[1]!] ?? 0)) % 12]!;
      const rest = m[2]!;
      const minor = m[1]! === m[1]!.toLowerCase() && !m[1]!.startsWith("b");
      return root + (minor && !rest.startsWith("ø") ? "m" : "") + rest.replace("ø7", "m7b5");
    })
    .join(" ");
}

function makeChart(i: number): string {
  const key = pick(KEYS);
  const tonic = NOTES.indexOf(key.replace("m", "")) >= 0 ? NOTES.indexOf(key.replace("m", "")) : 0;
  const bar = () => realise(pick(MAJOR_CELLS), tonic);
  const line = () => `| ${bar()} | ${bar()} | ${bar()} | ${bar()} |`;
  const melody = `melody: | C5:h D5:q E5:q | G4:w | r:q A4:q~ A4:h | F4:h. r:q |`;
  const hasIntro = i % 3 === 0;
  return [
    `title: Book Tune ${i + 1}`,
    `key: ${key}`,
    `time: ${i % 7 === 0 ? "3/4" : "4/4"}`,
    `tempo: ${90 + (i % 150)}`,
    hasIntro ? `Intro:\n${line()}` : "",
    "A:",
    `|: ${realise("Imaj7", tonic)} | ${bar()} | ${bar()} | ${bar()} |`,
    i % 7 === 0 ? "" : melody,
    `${line().replace(/ \|$/, "")} :|`,
    "B:",
    line(),
    line(),
    "A:",
    line(),
    `| ${bar()} | ${bar()} | [1 ${bar()} | ${bar()} :| [2 ${realise("Imaj7", tonic)} | % |`,
  ]
    .filter(Boolean)
    .join("\n");
}

const texts = Array.from({ length: COUNT }, (_, i) => makeChart(i));
for (const t of texts.slice(0, 50)) parseChartText(t); // warm up the JIT

const times: number[] = [];
const phase = { parse: 0, analyse: 0, intro: 0, arrange: 0 };
const start = performance.now();
const cpuStart = process.cpuUsage();
texts.forEach((text, i) => {
  const t0 = performance.now();
  const chart = parseChartText(text);
  const t1 = performance.now();
  analyseTop(chart);
  suggestIntros(chart);
  const t2 = performance.now();
  const intro = generateIntro(chart, { kind: INTRO_KINDS[i % INTRO_KINDS.length]!, tritoneSub: i % 2 === 0 });
  const t3 = performance.now();
  arrange(chart, { instrument: INSTRUMENT_IDS[i % INSTRUMENT_IDS.length], key: i % 4 === 0 ? "F" : undefined, intro: intro.choice ?? null });
  const t4 = performance.now();
  phase.parse += t1 - t0;
  phase.analyse += t2 - t1;
  phase.intro += t3 - t2;
  phase.arrange += t4 - t3;
  times.push(t4 - t0);
});
const total = performance.now() - start;
const cpu = process.cpuUsage(cpuStart);
const cpuMs = (cpu.user + cpu.system) / 1000;
times.sort((a, b) => a - b);
const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!;
const ms = (x: number) => `${x.toFixed(3)} ms`;
console.log(`music core: ${COUNT} charts — parse + analyse (top + all 7 intro fits) + one intro + arrangement`);
console.log(`  per chart: median ${ms(q(0.5))}, p95 ${ms(q(0.95))}, max ${ms(times[times.length - 1]!)}`);
console.log(`  CPU time ${ms(cpuMs)} in all, ${ms(cpuMs / COUNT)} a chart (steadier than wall time on a busy machine)`);
console.log(`  wall total ${ms(total)} (parse ${ms(phase.parse)}, analyse ${ms(phase.analyse)}, intro ${ms(phase.intro)}, arrangement ${ms(phase.arrange)})`);
