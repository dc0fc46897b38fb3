// Invented bars for layout tests: shapes only, no tune.
import type { Arrangement, ChordSlot, PerformanceBar } from "@/lib/chart/model";

export function bar(index: number, symbols: string[], extra: Partial<PerformanceBar> = {}): PerformanceBar {
  const share = 4 / Math.max(1, symbols.length);
  const chords: ChordSlot[] = symbols.map((symbol, i) => ({ symbol, beat: i * share, beats: share }));
  return {
    index,
    part: "form",
    section: null,
    chords,
    simile: false,
    repeatStart: false,
    repeatEnd: false,
    ending: null,
    barline: "single",
    source: null,
    ...extra,
  };
}

const CYCLE = [["Cm7"], ["F7"], ["Bbmaj7"], ["Ebmaj7"], ["Am7b5", "D7b9"], ["Gm6"], ["C7sus4"], ["F13(#11)"]];

/** `n` bars in sections of 8 (A, B, A, …); the first `intro` bars form an intro. */
export function arrangement(n: number, opts: { intro?: number; symbols?: (i: number) => string[] } = {}): Arrangement {
  const intro = opts.intro ?? 0;
  const bars: PerformanceBar[] = [];
  for (let i = 0; i < n; i++) {
    const inIntro = i < intro;
    const formBar = i - intro;
    const section = inIntro ? (i === 0 ? "Intro" : null) : formBar % 8 === 0 ? String.fromCharCode(65 + ((formBar / 8) % 3)) : null;
    const symbols = opts.symbols?.(i) ?? CYCLE[i % CYCLE.length] ?? ["C"];
    bars.push(bar(i, symbols, { part: inIntro ? "intro" : "form", section, barline: i === n - 1 ? "final" : "single" }));
  }
  return { bars, instrument: "bb", concertKey: "Eb", writtenKey: "F", meter: { beats: 4, unit: 4 }, intro: null };
}
