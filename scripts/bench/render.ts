// Render benchmark: bundles the layout + engraving code into a standalone page, opens it in headless
// Chromium (playwright-core, no app needed) and prints medians of
//   - layout + drawing one page of 32-, 64- and 128-bar charts, against raw VexFlow drawing the same
//     staves in the same run (target ≤ 1.25×, DESIGN.md §9);
//   - key press → next frame with the page swapped (target ≤ 16.7 ms).
// `--shots` also saves screenshots of the drawn page under test-results/screenshots/.
import http from "node:http";
import fs from "node:fs";
import path from "node:path";
import { build } from "esbuild";
import { chromium } from "playwright-core";

const root = path.resolve(import.meta.dirname, "../..");
const PORT = Number(process.env.BENCH_RENDER_PORT ?? 3401);
const RUNS = Number(process.env.BENCH_RUNS ?? 41);

const entry = `
import { layoutChart } from "@/lib/render/layout";
import { estimateSymbolWidth } from "@/lib/render/metrics";
import { engravePage } from "@/components/chart/engrave";
import { drawSheets, musicFontsReady } from "@/components/chart/draw-sheets";
import { PageFlipper } from "@/components/bandstand/flipper";
import { Renderer, Stave, Voice, Formatter, GlyphNote, Barline } from "@/components/chart/vexflow";

const CYCLE = [["Ebmaj7"], ["Cm7"], ["Fm7", "Bb7"], ["Gm7", "C7b9"], ["Abmaj7"], ["Db7(#11)"], ["Bb7sus4"], ["Ebmaj7"]];
function arrangement(n) {
  const bars = [];
  for (let i = 0; i < n; i++) {
    const symbols = CYCLE[i % CYCLE.length];
    const share = 4 / symbols.length;
    bars.push({
      index: i, part: i < 4 ? "intro" : "form",
      section: i === 0 ? "Intro" : (i - 4) % 8 === 0 ? String.fromCharCode(65 + ((i - 4) / 8) % 3) : null,
      chords: symbols.map((symbol, k) => ({ symbol, beat: k * share, beats: share })),
      simile: i % 16 === 9, repeatStart: i === 4, repeatEnd: i === 19, ending: i >= 18 && i < 20 ? 1 : null,
      barline: i === n - 1 ? "final" : (i - 3) % 8 === 0 ? "double" : "single", source: null,
    });
  }
  return { bars, instrument: "bb", concertKey: "Eb", writtenKey: "F", meter: { beats: 4, unit: 4 }, intro: null };
}
const W = 1024, H = 768;
const text = { title: "Lantern Street", composer: "R. Okafor", details: "medium swing · ♩ = 160 · Key of F", partLabel: "B♭ part" };
function host() { const h = document.getElementById("host"); h.replaceChildren(); return h; }

window.pp = {
  ready: () => musicFontsReady(),
  layoutAndDraw(n) {
    const arr = arrangement(n);
    const h = host();
    const t0 = performance.now();
    const layout = layoutChart(arr, { width: W, height: H });
    engravePage(h, { layout, page: layout.pages[0], writtenKey: "F", text });
    return performance.now() - t0;
  },
  /** Largest drawn width / estimated width over many symbols: must stay ≤ 1 for "never overlapping". */
  widthMargin() {
    const symbols = ["Ebmaj7", "Cm7", "Bb7sus4", "Db7(#11)", "C7(b9)", "F#m7b5", "Abm(maj7)", "G13(b9,#11)", "Bbmaj7/D", "Edim7", "N.C.", "Wmmm", "A7alt", "Gb6/9"];
    const layout = layoutChart({ bars: symbols.map((symbol, i) => ({ index: i, part: "form", section: null, chords: [{ symbol, beat: 0, beats: 4 }], simile: false, repeatStart: false, repeatEnd: false, ending: null, barline: "single", source: null })), instrument: "concert", concertKey: "C", writtenKey: "C", meter: { beats: 4, unit: 4 }, intro: null }, { width: W, height: 4000 });
    const h = host();
    engravePage(h, { layout, page: layout.pages[0], writtenKey: "C", text });
    let worst = { ratio: 0, symbol: "" };
    for (const t of h.querySelectorAll(".pp-chord")) {
      const sym = t.getAttribute("data-symbol");
      const ratio = t.getBBox().width / estimateSymbolWidth(sym, layout.chordFontSize);
      if (ratio > worst.ratio) worst = { ratio, symbol: sym };
    }
    return worst;
  },
  /** A bar with a melody is drawn with its notes (a check that the path runs, with a screenshot). */
  melody() {
    const mel = [
      { pitch: "G4", duration: "q", dots: 0, tie: false }, { pitch: "Bb4", duration: "8", dots: 0, tie: false },
      { pitch: "C5", duration: "8", dots: 0, tie: true }, { pitch: "C5", duration: "h", dots: 0, tie: false },
    ];
    const rest = [{ pitch: null, duration: "h", dots: 0, tie: false }, { pitch: "F#4", duration: "h", dots: 0, tie: false }];
    const arr = arrangement(8);
    arr.bars[4].melody = mel;
    arr.bars[5].melody = rest;
    const layout = layoutChart(arr, { width: W, height: H });
    const h = host();
    engravePage(h, { layout, page: layout.pages[0], writtenKey: "F", text });
    return h.querySelectorAll(".vf-stavenote").length;
  },
  layoutOnly(n) {
    const arr = arrangement(n);
    const t0 = performance.now();
    layoutChart(arr, { width: W, height: H });
    return performance.now() - t0;
  },
  raw(n) {
    const layout = layoutChart(arrangement(n), { width: W, height: H });
    const page = layout.pages[0];
    const h = host();
    const t0 = performance.now();
    const r = new Renderer(h, Renderer.Backends.SVG);
    r.resize(Math.round(page.width * page.zoom), Math.round(page.height * page.zoom));
    const ctx = r.getContext();
    ctx.scale(page.zoom, page.zoom);
    ctx.fillText(text.title, 400, 50);
    for (const s of page.systems) for (const b of s.bars) {
      const st = new Stave(b.x, s.staffY, b.width, { spaceAboveStaffLn: 0, spaceBelowStaffLn: 0 });
      if (b.showClef) st.addClef("treble");
      if (b.showKey) st.addKeySignature("F");
      if (b.showTime) st.addTimeSignature("4/4");
      if (b.bar.repeatStart) st.setBegBarType(Barline.type.REPEAT_BEGIN);
      st.setEndBarType(b.bar.repeatEnd ? Barline.type.REPEAT_END : b.bar.barline === "final" ? Barline.type.END : b.bar.barline === "double" ? Barline.type.DOUBLE : Barline.type.SINGLE);
      st.setContext(ctx).draw();
      const notes = [0, 1, 2, 3].map(() => new GlyphNote("\\uE101", { duration: "q" }, { line: 2 }));
      const v = new Voice({ numBeats: 4, beatValue: 4 }).setMode(Voice.Mode.SOFT).addTickables(notes);
      new Formatter().joinVoices([v]).formatToStave([v], st);
      v.draw(ctx, st);
      ctx.setFont("Academico", 24);
      for (const c of b.chords) ctx.fillText(c.symbol, c.x, s.staffY - 12);
    }
    return performance.now() - t0;
  },
  /** ahead: wait until idle time has drawn every page; else turn at once (only pages 1-2 drawn). */
  async flipSetup(n, ahead) {
    const h = host();
    h.className = "pp-sheets";
    h.style.width = W + "px"; h.style.height = H + "px";
    const layout = layoutChart(arrangement(n), { width: W, height: H });
    const job = drawSheets(h, { layout, writtenKey: "F", text });
    if (ahead) await job.done;
    // As PagedChart does: after each turn the page after the new one is drawn in the next task.
    const flipper = new PageFlipper(h, layout.pages.length, { halfFractions: layout.pages.map((p) => p.halfY / p.height) }, null, false, () => job.show(Number(h.dataset.page)));
    window.latencies = [];
    window.onkeydown = null;
    let dir = 1;
    window.onkeydown = (e) => {
      const t0 = e.timeStamp;
      if (!flipper.go(dir)) { dir = -dir; flipper.go(dir); }
      requestAnimationFrame(() => window.latencies.push(performance.now() - t0));
    };
    return layout.pages.length;
  },
};
`;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? (s[m] ?? 0) : ((s[m - 1] ?? 0) + (s[m] ?? 0)) / 2;
}

async function main() {
  const bundle = await build({
    stdin: { contents: entry, resolveDir: root, loader: "ts" },
    bundle: true,
    write: false,
    format: "esm",
    target: "es2022",
    minify: true,
    tsconfig: path.join(root, "tsconfig.json"),
    logLevel: "warning",
  });
  const js = bundle.outputFiles[0]?.text ?? "";
  const css = fs.readFileSync(path.join(root, "components/chart/sheets.css"), "utf8");
  const html = `<!doctype html><html><head><meta charset="utf-8"><style>${css} body{margin:0;background:#fff;color:#000}</style></head><body><div id="host"></div><script type="module" src="/b.js"></script></body></html>`;
  const server = http.createServer((req, res) => {
    const font = /^\/fonts\/([\w-]+\.woff2)$/.exec(req.url ?? "");
    if (req.url === "/b.js") res.writeHead(200, { "content-type": "text/javascript" }).end(js);
    // The engraving's font files, as the app serves them from public/fonts.
    else if (font) res.writeHead(200, { "content-type": "font/woff2" }).end(fs.readFileSync(path.join(root, "public/fonts", font[1]!)));
    else res.writeHead(200, { "content-type": "text/html" }).end(html);
  });
  await new Promise<void>((r) => server.listen(PORT, "127.0.0.1", r));
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--no-sandbox", "--headless", "--disable-gpu", "--disable-background-networking", "--no-first-run"],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1024, height: 768 } });
    const outside: string[] = [];
    page.on("request", (r) => {
      if (!r.url().startsWith(`http://127.0.0.1:${PORT}`) && !r.url().startsWith("data:")) outside.push(r.url());
    });
    await page.goto(`http://127.0.0.1:${PORT}/`);
    await page.waitForFunction(() => "pp" in window);
    await page.evaluate(() => (window as unknown as { pp: { ready: () => Promise<void> } }).pp.ready());
    type PP = { layoutOnly: (n: number) => number; layoutAndDraw: (n: number) => number; raw: (n: number) => number; flipSetup: (n: number, ahead: boolean) => Promise<number> };
    console.log(`render bench · Chromium headless · 1024×768 · medians of ${RUNS} runs`);
    console.log("bars | layout+draw page 1 (ms) | raw VexFlow same staves (ms) | ratio | layout alone (ms)");
    for (const n of [32, 64, 128]) {
      const ours: number[] = [];
      const raw: number[] = [];
      const lay: number[] = [];
      for (let i = 0; i < RUNS + 3; i++) {
        // Alternate the two so warm-up and GC pauses fall on both alike; drop the first rounds.
        const a = await page.evaluate((k) => (window as unknown as { pp: PP }).pp.layoutAndDraw(k), n);
        const b = await page.evaluate((k) => (window as unknown as { pp: PP }).pp.raw(k), n);
        const c = await page.evaluate((k) => (window as unknown as { pp: PP }).pp.layoutOnly(k), n);
        if (i >= 3) {
          lay.push(c);
          ours.push(a);
          raw.push(b);
        }
      }
      const mo = median(ours);
      const mr = median(raw);
      console.log(`${String(n).padStart(4)} | ${mo.toFixed(2).padStart(24)} | ${mr.toFixed(2).padStart(28)} | ${(mo / mr).toFixed(2)}× | ${median(lay).toFixed(2)}`);
    }
    const notes = await page.evaluate(() => (window as unknown as { pp: { melody: () => number } }).pp.melody());
    console.log(`melody check: ${notes} melody notes drawn (6 expected)`);
    if (process.argv.includes("--shots")) {
      await page.screenshot({ path: path.join(root, "test-results/screenshots/bench-melody.png") });
      fs.mkdirSync(path.join(root, "test-results/screenshots"), { recursive: true });
      await page.evaluate(() => (window as unknown as { pp: PP }).pp.layoutAndDraw(64));
      await page.screenshot({ path: path.join(root, "test-results/screenshots/bench-page1.png") });
    }
    const margin = await page.evaluate(() => (window as unknown as { pp: { widthMargin: () => { ratio: number; symbol: string } } }).pp.widthMargin());
    console.log(`chord symbols: widest drawn/estimated width ${margin.ratio.toFixed(2)} (${margin.symbol}); ≤ 1 means the layout's boxes hold them`);
    for (const ahead of [true, false]) {
      const pages = await page.evaluate((a) => (window as unknown as { pp: PP }).pp.flipSetup(128, a), ahead);
      for (let i = 0; i < 40; i++) {
        await page.keyboard.press("PageDown");
        await page.waitForTimeout(30);
      }
      const lat = await page.evaluate(() => (window as unknown as { latencies: number[] }).latencies);
      const how = ahead ? "every page drawn in idle time first" : "turning at once, only pages 1-2 drawn";
      console.log(`page turn (${pages} pages, ${how}, ${lat.length} presses): key press → next frame median ${median(lat).toFixed(2)} ms, max ${Math.max(...lat).toFixed(2)} ms (target ≤ 16.7 ms)`);
    }
    console.log(`requests leaving the page's origin while drawing: ${outside.length}`);
  } finally {
    await browser.close();
    server.close();
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
