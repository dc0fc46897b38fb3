// What a player reads: the chosen intro prepended and labelled, the form with its sections, repeats
// and endings, everything in the concert key asked for and then in the part's written key.
import {
  formatChord, instrumentOf, moveChord, movePitch, nearestShift, parseChord, parseKey, simplestKey, writtenKeyInfo, writtenPitch,
  type KeyInfo,
} from "@/lib/music";
import type { Arrangement, Bar, Barline, Chart, ChordSlot, PerformanceBar, PerformanceOptions, Section } from "./model";
import { generateIntro } from "./intro";

/** Chords moved between keys, remembered per symbol (a book repeats the same few hundred chords). */
function chordMover(from: KeyInfo, to: KeyInfo): (symbol: string) => string {
  if (from.tonic === to.tonic) return (s) => s;
  const memo = new Map<string, string>();
  return (symbol) => {
    let out = memo.get(symbol);
    if (out === undefined) {
      out = formatChord(moveChord(parseChord(symbol), from, to));
      memo.set(symbol, out);
    }
    return out;
  };
}

/**
 * The chart in another concert key (a singer's key). The mode stays the chart's: asking for "D" on a
 * tune in Cm gives Dm. The key is spelled with the fewer accidentals (C# → Db; F#/Gb as asked).
 */
export function transposeChart(chart: Chart, toConcertKey: string): Chart {
  const from = parseKey(chart.key);
  const asked = parseKey(toConcertKey);
  const to = simplestKey({ tonic: asked.tonic, minor: from.minor, name: asked.tonic + (from.minor ? "m" : "") }, asked.tonic.includes("#"));
  if (to.name === from.name) return chart;
  const move = chordMover(from, to);
  const shift = nearestShift(from.tonic, to.tonic);
  const moveBar = (b: Bar): Bar => {
    const out: Bar = { ...b, chords: b.chords.map((c) => ({ ...c, symbol: move(c.symbol) })) };
    if (b.melody) out.melody = b.melody.map((n) => ({ ...n, pitch: n.pitch === null ? null : movePitch(n.pitch, from, to, shift) }));
    return out;
  };
  const moveSection = (s: Section): Section => ({ ...s, bars: s.bars.map(moveBar) });
  return { ...chart, key: to.name, intro: chart.intro ? moveSection(chart.intro) : null, sections: chart.sections.map(moveSection) };
}

export function arrange(chart: Chart, opts: PerformanceOptions = {}): Arrangement {
  const instrument = instrumentOf(opts.instrument ?? "concert");
  const concert = opts.key ? transposeChart(chart, opts.key) : chart;
  const concertKey = parseKey(concert.key);
  const written = writtenKeyInfo(concert.key, instrument.id);
  const intro =
    opts.intro === null ? null : opts.intro === undefined ? (concert.intro ? generateIntro(concert, { kind: "composed" }) : null) : generateIntro(concert, opts.intro);
  const move = chordMover(concertKey, written);
  const moveChords = (chords: ChordSlot[]) => chords.map((c) => ({ ...c, symbol: move(c.symbol) }));
  const bars: PerformanceBar[] = [];
  const push = (b: Bar, part: PerformanceBar["part"], section: string | null, barline: Barline, source: PerformanceBar["source"]) => {
    const pb: PerformanceBar = {
      index: bars.length,
      part,
      section,
      chords: moveChords(b.chords),
      simile: b.simile,
      repeatStart: b.repeatStart,
      repeatEnd: b.repeatEnd,
      ending: b.ending,
      barline,
      source,
    };
    if (b.repeatTimes !== undefined) pb.repeatTimes = b.repeatTimes;
    if (b.pickup !== undefined) pb.pickup = b.pickup;
    if (b.melody) pb.melody = b.melody.map((n) => ({ ...n, pitch: writtenPitch(n.pitch, concert.key, instrument.id) }));
    bars.push(pb);
  };
  if (intro && intro.bars.length > 0) {
    const composed = intro.kind === "composed";
    intro.bars.forEach((b, i) => {
      const inner = intro.labels?.[i];
      const label = i === 0 ? "Intro" : inner ? `Intro · ${inner}` : null;
      push(b, "intro", label, i === intro.bars.length - 1 ? "double" : "single", composed ? { section: -1, bar: i % (concert.intro?.bars.length ?? 1) } : null);
    });
  }
  concert.sections.forEach((s, si) => {
    s.bars.forEach((b, bi) => {
      const lastOfSection = bi === s.bars.length - 1;
      const lastOfChart = lastOfSection && si === concert.sections.length - 1;
      push(b, "form", bi === 0 ? s.label : null, lastOfChart ? "final" : lastOfSection ? "double" : "single", { section: si, bar: bi });
    });
  });
  return { bars, instrument: instrument.id, concertKey: concert.key, writtenKey: written.name, meter: concert.meter, intro };
}

/** The bars to read: see `arrange`. `intro: undefined` plays the chart's composed intro if it has one; `null` none. */
export function performanceBars(chart: Chart, opts: PerformanceOptions = {}): PerformanceBar[] {
  return arrange(chart, opts).bars;
}
