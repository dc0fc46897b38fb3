// What a player reads: the chosen intro prepended and labelled, the form with its sections, repeats
// and endings, everything in the concert key asked for and then in the part's written key.
import {
  formatChord, instrumentOf, moveChord, movePitch, nearestShift, parseChord, parseKey, simplestKey, writtenKeyInfo, writtenPitch,
  type KeyInfo,
} from "@/lib/music";
import type { Arrangement, Bar, Barline, Chart, ChordSlot, IntroResult, PerformanceBar, PerformanceOptions, Section, TagEnding } from "./model";
import { generateIntro } from "./intro";
import { lastPassMask } from "./as-played";
import { prettyMusic } from "./intro-reader";

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
    if (b.endingPasses) pb.endingPasses = b.endingPasses;
    if (b.pickup !== undefined) pb.pickup = b.pickup;
    if (b.melody) pb.melody = b.melody.map((n) => ({ ...n, pitch: writtenPitch(n.pitch, concert.key, instrument.id) }));
    bars.push(pb);
  };
  if (intro && intro.bars.length > 0) {
    const composed = intro.kind === "composed";
    const first = bars.length;
    intro.bars.forEach((b, i) => {
      const inner = intro.labels?.[i];
      const label = i === 0 ? "Intro" : inner ? `Intro · ${inner}` : null;
      push(b, "intro", label, i === intro.bars.length - 1 ? "double" : "single", composed ? { section: -1, bar: i % (concert.intro?.bars.length ?? 1) } : null);
    });
    introDirections(intro, bars.slice(first), move);
  }
  const tag = opts.tag && opts.tag.bars > 0 && opts.tag.times > 0 ? tagBars(concert, opts.tag) : [];
  concert.sections.forEach((s, si) => {
    s.bars.forEach((b, bi) => {
      const lastOfSection = bi === s.bars.length - 1;
      const lastOfChart = lastOfSection && si === concert.sections.length - 1;
      const end = lastOfChart && !tag.length ? "final" : lastOfSection ? "double" : "single";
      push(b, "form", bi === 0 ? s.label : null, end, { section: si, bar: bi });
    });
  });
  tag.forEach((t, i) => push(t.bar, "tag", i === 0 ? `Tag ×${opts.tag!.times}` : null, i === tag.length - 1 ? "final" : "single", t.source));
  return { bars, instrument: instrument.id, concertKey: concert.key, writtenKey: written.name, meter: concert.meter, intro };
}

/** The pedal note under a dominant pedal and "till cue" on an open vamp, in the part's key. */
function introDirections(intro: IntroResult, introBars: PerformanceBar[], move: (symbol: string) => string): void {
  const first = introBars[0];
  const last = introBars[introBars.length - 1];
  // Moving the pedal note as a bare triad names it in the part's key and spelling.
  if (intro.pedal && first) first.direction = `${prettyMusic(move(intro.pedal))} pedal`;
  if (intro.cue && last) last.direction = intro.cue;
}

/**
 * The tag: the last `bars` bars the band plays the last time through (endings and `%` resolved),
 * inside repeat signs marked with the number of times, or written out once for a single time.
 */
function tagBars(chart: Chart, tag: TagEnding): { bar: Bar; source: PerformanceBar["source"] }[] {
  const played: { bar: Bar; source: { section: number; bar: number } }[] = [];
  chart.sections.forEach((s, si) => {
    const keep = lastPassMask(s.bars);
    s.bars.forEach((b, bi) => keep[bi] && played.push({ bar: b, source: { section: si, bar: bi } }));
  });
  const taken = played.slice(-tag.bars);
  return taken.map((p, i) => {
    const bar: Bar = { ...p.bar, chords: p.bar.chords.map((c) => ({ ...c })), repeatStart: false, repeatEnd: false, ending: null };
    delete bar.repeatTimes;
    // A `%` at the tag's first bar has nothing before it on the line: write its chords out.
    if (bar.simile && i === 0) {
      const before = played[played.length - tag.bars - 1];
      bar.simile = false;
      bar.chords = before ? before.bar.chords.map((c) => ({ ...c })) : [];
    }
    if (tag.times > 1) {
      if (i === 0) bar.repeatStart = true;
      if (i === taken.length - 1) {
        bar.repeatEnd = true;
        bar.repeatTimes = tag.times;
      }
    }
    return { bar, source: p.source };
  });
}

/** The bars to read: see `arrange`. `intro: undefined` plays the chart's composed intro if it has one; `null` none. */
export function performanceBars(chart: Chart, opts: PerformanceOptions = {}): PerformanceBar[] {
  return arrange(chart, opts).bars;
}
