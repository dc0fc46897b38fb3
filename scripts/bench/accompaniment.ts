// Accompaniment benchmark:
//   - generating the events for a 32-bar chart with a 4-bar intro (target ≤ 5 ms), in Node;
//   - the main-thread time playback costs each second while the bandstand pages turn, and the page
//     turn (key press → next frame) with and without playback (target: within one frame, 16.7 ms).
//     Runs the real engine (Tone.js, synthesized band) and the real page flipper in headless Chromium.
import http from "node:http";
import fs from "node:fs";
import path from "node:path";
import { build } from "esbuild";
import { chromium } from "playwright-core";
import { arrange, parseChartText } from "@/lib/chart";
import { generateAccompaniment } from "@/lib/accompaniment";

const root = path.resolve(import.meta.dirname, "../..");
const PORT = Number(process.env.BENCH_AUDIO_PORT ?? 3402);
const RUNS = Number(process.env.BENCH_RUNS ?? 201);
const WINDOW_MS = 6000;

// Invented for the bench: a 32-bar AABA with a repeat, a bridge and an intro.
const CHART = `title: Bench Tune
key: Eb
time: 4/4
tempo: 160
feel: medium swing

Intro:
| Cm7 F7 | Fm7 Bb7 | Gm7 C7 | Fm7 Bb7(b9) |
A:
|: Ebmaj7 | Cm7 | Fm7 Bb7 | Gm7 C7(b9) | Fm7 | Bb7sus4 Bb7 | [1 Ebmaj7 C7 | Fm7 Bb7 :| [2 Ebmaj7 | % |
B:
| Am7b5 | D7(b9) | Gm7 | C7 | Fm7 | Ab7(#11) | Gm7 C7 | Fm7 Bb7 |
A:
| Ebmaj7 | Cm7 | Fm7 Bb7 | Gm7 C7 | Fm7 | Bb7alt | Ebmaj7 Ab7 | Gm7 C7 |
`;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? (s[m] ?? 0) : ((s[m - 1] ?? 0) + (s[m] ?? 0)) / 2;
}

function generation(): void {
  const chart = parseChartText(CHART);
  const a = arrange(chart, { instrument: "concert" });
  const req = { bars: a.bars, meter: a.meter, tempo: 160, feel: chart.feel, key: a.concertKey };
  const times: number[] = [];
  let bars = 0;
  let events = 0;
  for (let i = 0; i < RUNS + 20; i++) {
    const t0 = performance.now();
    const acc = generateAccompaniment(req);
    const dt = performance.now() - t0;
    if (i >= 20) times.push(dt);
    bars = acc.bars.length;
    events = acc.events.length;
  }
  console.log(`generation · ${bars} played bars (4 intro + 32 form with its repeat) · ${events} events`);
  console.log(`  median ${median(times).toFixed(3)} ms · p90 ${[...times].sort((x, y) => x - y)[Math.floor(times.length * 0.9)]!.toFixed(3)} ms (target ≤ 5 ms), ${RUNS} runs`);
}

const entry = `
import { arrange, parseChartText } from "@/lib/chart";
import { layoutChart } from "@/lib/render/layout";
import { drawSheets, musicFontsReady } from "@/components/chart/draw-sheets";
import { PageFlipper } from "@/components/bandstand/flipper";
import { play } from "@/components/player/engine";
import { BarMarker } from "@/components/player/marker";
import { follow } from "@/components/player/follow";
const CHART = ${JSON.stringify(CHART)};
const chart = parseChartText(CHART);
let flipper, stopFollow, playback;
window.latencies = [];
window.pp = {
  ready: () => musicFontsReady(),
  async setup() {
    const host = document.getElementById("host");
    const arr = arrange(chart, { instrument: "bb" });
    const layout = layoutChart(arr, { width: 390, height: 650 });
    await drawSheets(host, { layout, writtenKey: arr.writtenKey, text: { title: "Bench Tune", composer: "", details: "", partLabel: "B♭ part" } }).done;
    flipper = new PageFlipper(host, layout.pages.length, { halfFractions: layout.pages.map((p) => p.halfY / p.height) }, null, false);
    let dir = 1;
    window.addEventListener("keydown", (e) => {
      const t0 = e.timeStamp;
      if (!flipper.go(dir)) { dir = -dir; flipper.go(dir); }
      requestAnimationFrame(() => window.latencies.push(performance.now() - t0));
    });
    return layout.pages.length;
  },
  async start() {
    const a = arrange(chart, { instrument: "concert" });
    playback = await play({ request: { bars: a.bars, meter: a.meter, tempo: 160, feel: chart.feel, key: a.concertKey, loop: true, range: { from: 1, to: 36 } }, mutes: { piano: false, bass: false, drums: false }, volume: 0.5 });
    const marker = new BarMarker();
    stopFollow = follow(playback, { host: () => document.getElementById("host"), marker, loop: true, onBar: () => {}, onEnd: () => {} });
  },
  stop() { stopFollow?.(); playback?.stop(); },
};
`;

async function browserPart(): Promise<void> {
  const bundle = await build({
    stdin: { contents: entry, resolveDir: root, loader: "ts" },
    bundle: true,
    write: false,
    format: "esm",
    target: "es2022",
    minify: true,
    tsconfig: path.join(root, "tsconfig.json"),
    logLevel: "error",
  });
  const js = bundle.outputFiles[0]?.text ?? "";
  const css = fs.readFileSync(path.join(root, "components/chart/sheets.css"), "utf8") + fs.readFileSync(path.join(root, "components/player/player.css"), "utf8");
  const html = `<!doctype html><html><head><meta charset="utf-8"><style>${css} body{margin:0}#host{width:390px;height:650px}</style></head><body><div id="host" class="pp-sheets"></div><script type="module" src="/b.js"></script></body></html>`;
  const server = http.createServer((req, res) => {
    if (req.url === "/b.js") res.writeHead(200, { "content-type": "text/javascript" }).end(js);
    else res.writeHead(200, { "content-type": "text/html" }).end(html);
  });
  await new Promise<void>((r) => server.listen(PORT, "127.0.0.1", r));
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--no-sandbox", "--headless", "--disable-gpu", "--disable-background-networking", "--no-first-run", "--autoplay-policy=no-user-gesture-required"],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 390, height: 700 } });
    const cdp = await page.context().newCDPSession(page);
    await cdp.send("Performance.enable");
    await page.goto(`http://127.0.0.1:${PORT}/`);
    await page.waitForFunction(() => "pp" in window);
    type PP = { ready: () => Promise<void>; setup: () => Promise<number>; start: () => Promise<void>; stop: () => void };
    await page.evaluate(() => (window as unknown as { pp: PP }).pp.ready());
    const pages = await page.evaluate(() => (window as unknown as { pp: PP }).pp.setup());
    const busy = async () => {
      const { metrics } = await cdp.send("Performance.getMetrics");
      return metrics.find((m) => m.name === "TaskDuration")?.value ?? 0;
    };
    const window_ = async () => {
      await page.evaluate(() => ((window as unknown as { latencies: number[] }).latencies = []));
      const before = await busy();
      const t0 = Date.now();
      while (Date.now() - t0 < WINDOW_MS) {
        await page.keyboard.press("PageDown");
        await page.waitForTimeout(400);
      }
      const spent = ((await busy()) - before) * 1000;
      const lat = await page.evaluate(() => (window as unknown as { latencies: number[] }).latencies);
      return { perSecond: spent / ((Date.now() - t0) / 1000), turn: median(lat), turns: lat.length };
    };
    const quiet = await window_();
    await page.evaluate(() => (window as unknown as { pp: PP }).pp.start());
    await page.waitForTimeout(1000);
    const playing = await window_();
    await page.evaluate(() => (window as unknown as { pp: PP }).pp.stop());
    console.log(`playback on the main thread · Chromium headless · 390×700 · ${pages} pages · a turn every 400 ms for ${WINDOW_MS / 1000} s`);
    console.log(`  main-thread busy: ${quiet.perSecond.toFixed(1)} ms/s turning pages alone, ${playing.perSecond.toFixed(1)} ms/s while playing → playback costs ${(playing.perSecond - quiet.perSecond).toFixed(1)} ms a second`);
    console.log(`  page turn key → next frame (median): ${quiet.turn.toFixed(2)} ms alone, ${playing.turn.toFixed(2)} ms while playing (${playing.turns} turns; target ≤ 16.7 ms)`);
  } finally {
    await browser.close();
    server.close();
  }
}

generation();
await browserPart();
