// Intros: the seven kinds a band starts a tune with, each with a plain explanation and a fit analysis.
import {
  ChordSymbolError, chordPitchClasses, dominantOf, formatChord, isDominantChord, isMinorChord, keyScale, parseChord, parseKey,
  progressionNumerals, qualityOf, tritoneSubstitute, turnaround, twoFiveInto, type ChordTones,
} from "@/lib/music";
import { Note } from "tonal";
import { INTRO_KINDS, type Bar, type Chart, type IntroChoice, type IntroKind, type IntroResult, type Meter } from "./model";
import { analyseTop, barOf, barsAsPlayed, blankBar, firstChord, formAsPlayed, lastPassBars, plainCopy, secondsFor, type TopAnalysis } from "./as-played";
import { CONCERT_READER, type IntroReader } from "./intro-reader";

export { CONCERT_READER, type IntroReader } from "./intro-reader";

export interface IntroOptions {
  kind: IntroKind;
  bars?: number;
  repeats?: number;
  tritoneSub?: boolean;
  vamp?: readonly [string, string] | [string, string];
  variant?: IntroChoice["variant"];
  /** How the advice names chords, notes and keys: the reader's part (default concert, ♭/♯ spelled). */
  read?: IntroReader;
}

/** Kinds that suit this tune, best first, leaving out `except`. */
function fitting(top: TopAnalysis, chart: Chart, except: IntroKind): IntroKind[] {
  const order: IntroKind[] = top.startsOnTonic
    ? ["turnaround", "dominant-pedal", "two-five", "last-bars"]
    : ["two-five", "dominant-pedal", "last-bars", "vamp"];
  if (chart.intro) order.unshift("composed");
  return order.filter((k) => k !== except);
}

/** Spread chord cells over `bars` bars: fewer bars → several chords a bar; more → chords held longer (`%`). */
function spread(cells: string[], asked: number, meter: Meter): Bar[] {
  const n = cells.length;
  const bars = Math.max(asked, Math.ceil(n / meter.beats)); // never more chords than beats in a bar
  const out: Bar[] = [];
  if (bars >= n) {
    cells.forEach((c, i) => {
      const count = Math.floor(((i + 1) * bars) / n) - Math.floor((i * bars) / n);
      for (let k = 0; k < count; k++) out.push(k === 0 ? barOf([c], meter) : { ...blankBar(), simile: true });
    });
    return out;
  }
  for (let i = 0; i < bars; i++) out.push(barOf(cells.slice(Math.floor((i * n) / bars), Math.floor(((i + 1) * n) / bars)), meter));
  return out;
}

function withRepeats(bars: Bar[], repeats: number): Bar[] {
  if (repeats <= 1 || bars.length === 0) return bars;
  const hasMarks = bars.some((b) => b.repeatStart || b.repeatEnd || b.ending !== null);
  if (hasMarks) return Array.from({ length: repeats }, () => bars.map((b) => ({ ...b, chords: b.chords.map((c) => ({ ...c })) }))).flat();
  const out = bars.map((b) => ({ ...b }));
  out[0]!.repeatStart = true;
  const last = out[out.length - 1]!;
  last.repeatEnd = true;
  if (repeats > 2) last.repeatTimes = repeats;
  return out;
}

const sub = (symbol: string, on: boolean) => (on && isDominantChord(symbol) ? tritoneSubstitute(symbol) : symbol);

/** Is this chord a dominant of `target` (its V7, or the V7's tritone substitute a half step above)? */
function dominantInto(symbol: string, target: ChordTones): boolean {
  const c = parseChord(symbol);
  if (c.kind !== "chord" || !isDominantChord(c)) return false;
  const ch = Note.chroma(c.root);
  const t = Note.chroma(target.root);
  return ch === (t + 7) % 12 || ch === (t + 1) % 12;
}

/** Replace the last bar so it points back at the top: ii–V (or V) of the first chord. */
function turnBack(bars: Bar[], target: ChordTones, meter: Meter, tritone: boolean): { bars: Bar[]; turned: string | null } {
  const last = bars[bars.length - 1];
  if (!last) return { bars, turned: null };
  const lastChord = last.chords[last.chords.length - 1]?.symbol;
  if (lastChord && dominantInto(lastChord, target)) return { bars, turned: null };
  const [two, five] = twoFiveInto(formatChord({ ...target, bass: null }), tritone);
  const cells = meter.beats >= 2 && meter.beats % 2 === 0 ? [two, five] : [five];
  const turnedBar: Bar = { ...barOf(cells, meter), repeatStart: last.repeatStart, repeatEnd: last.repeatEnd, ending: last.ending };
  if (last.repeatTimes) turnedBar.repeatTimes = last.repeatTimes;
  if (last.endingPasses) turnedBar.endingPasses = last.endingPasses;
  return { bars: [...bars.slice(0, -1), turnedBar], turned: cells.join(" ") };
}

function suggestedVamp(target: ChordTones, chart: Chart): [string, string] {
  const t = formatChord({ ...target, bass: null, alterations: [] });
  const up = (ivl: string) => Note.pitchClass(Note.transpose(target.root, ivl));
  if (isDominantChord(target)) {
    // A blues starting on I7 vamps I7–IV7; another dominant on its own sus.
    const onTonic = Note.chroma(target.root) === Note.chroma(parseKey(chart.key).tonic);
    return onTonic ? [t, `${up("4P")}7`] : [`${target.root}7sus4`, `${target.root}7`];
  }
  if (isMinorChord(target)) {
    if (target.quality === "m7b5" || target.quality.startsWith("dim")) return [t, dominantOf(target.root)];
    return [t, `${up("4P")}7`];
  }
  return [t, `${up("2M")}m7`];
}

/** The scale a player hears over bar 1's chord (major, mixolydian, dorian, locrian…), as intervals. */
function chordScale(target: ChordTones): string[] {
  const fam = qualityOf(target).family;
  if (fam === "half-diminished") return ["1P", "2m", "3m", "4P", "5d", "6m", "7m"];
  if (fam === "diminished") return ["1P", "2M", "3m", "4P", "5d", "6m", "6M", "7M"];
  if (fam === "augmented") return ["1P", "2M", "3M", "4A", "5A", "7m"];
  if (fam === "minor") return ["1P", "2M", "3m", "4P", "5P", "6M", "7m", "7M"];
  const seventh = isDominantChord(target) ? "7m" : "7M";
  return ["1P", "2M", "3M", "4P", "5P", "6M", seventh];
}

/** Notes of a chord foreign both to the key and to bar 1's chord and scale (a raised 6th/7th is at home in minor). */
function foreignNotes(symbol: string, chart: Chart, target: ChordTones): string[] {
  const key = parseKey(chart.key);
  const home = new Set(
    [...keyScale(key), ...chordPitchClasses(target), ...chordScale(target).map((i) => Note.transpose(target.root, i))].map((p) => Note.chroma(p)),
  );
  if (key.minor) for (const ivl of ["6M", "7M"]) home.add(Note.chroma(Note.transpose(key.tonic, ivl)));
  return chordPitchClasses(symbol).filter((p) => !home.has(Note.chroma(p)));
}

function result(kind: IntroKind, bars: Bar[], fits: boolean, advice: string, suggestions: IntroKind[], extra: Partial<IntroResult> = {}): IntroResult {
  return { kind, bars, fits, advice, suggestions: fits ? [] : suggestions, ...extra };
}

const clamp = (n: number | undefined, lo: number, hi: number) => (n === undefined || !Number.isFinite(n) ? undefined : Math.min(hi, Math.max(lo, Math.round(n))));

export function generateIntro(chart: Chart, options: IntroOptions): IntroResult {
  const opts: IntroOptions = { ...options, bars: clamp(options.bars, 1, 64), repeats: clamp(options.repeats, 1, 16) };
  const { kind } = opts;
  const r = opts.read ?? CONCERT_READER;
  const meter = chart.meter;
  const top = analyseTop(chart);
  const target = firstChord(chart);
  const tritone = opts.tritoneSub ?? false;
  const base: IntroChoice = { kind, ...(tritone ? { tritoneSub: true } : {}) };
  // The options as played, defaults filled in, so a set list can store exactly this intro.
  const chosen = (bars: number | undefined, repeats: number, extra: Partial<IntroChoice> = {}): IntroChoice => ({
    ...base,
    ...(bars !== undefined ? { bars } : {}),
    repeats,
    ...extra,
  });
  const choice = chosen(opts.bars, opts.repeats ?? 1);
  const others = fitting(top, chart, kind);
  if (!target) return withoutChords(chart, kind, choice, opts.repeats ?? 1);
  const tgt = target;
  const topName = top.symbol ? r.chord(top.symbol) : "the top";
  const chords = (list: readonly string[], sep = " ") => list.map(r.chord).join(sep);
  switch (kind) {
    case "dominant-pedal": {
      const n = opts.bars ?? 4;
      const v = dominantOf(tgt.root);
      const pedal = dominantOf(tgt.root, "7sus4");
      const resolveTo = sub(v, tritone);
      const last = meter.beats >= 2 ? [barOf([pedal, resolveTo], meter)] : [barOf([pedal], meter), barOf([resolveTo], meter)];
      const bars = [...Array.from({ length: n - 1 }, () => barOf([pedal], meter)), ...last];
      const pedalNote = v.replace(/7$/, "");
      const advice = `A pedal on ${r.note(pedalNote)}: ${r.chord(pedal)} for ${n} bar${n > 1 ? "s" : ""}, opening to ${r.chord(resolveTo)} at the end and resolving to ${topName} at the top.`;
      return result(kind, withRepeats(bars, opts.repeats ?? 1), true, advice, others, { choice: chosen(n, opts.repeats ?? 1), pedal: pedalNote });
    }
    case "last-bars": {
      const n = opts.bars ?? 8;
      const pass = lastPassBars(chart);
      const fits = pass.length >= n;
      const taken = pass.slice(-n).map((b, i, arr) => plainCopy(b, arr[i - 1]));
      const { bars, turned } = turnBack(taken, tgt, meter, tritone);
      const advice = fits
        ? `The last ${n} bars of the form${turned ? `, with the last bar turned into ${chords(turned.split(" "))} to lead back to ${topName}` : ", whose last bar already leads back to the top"}.`
        : `The last time through, the form is only ${pass.length} bars, shorter than ${n}: this plays all of it. Take ${Math.min(4, pass.length)} bars or a solo chorus instead.`;
      return result(kind, withRepeats(bars, opts.repeats ?? 1), fits, advice, ["solo-chorus", ...others.filter((k) => k !== "solo-chorus")], { choice: chosen(n, opts.repeats ?? 1) });
    }
    case "vamp":
      return vampIntro(chart, opts, tgt, topName, others, r);
    case "solo-chorus": {
      const choruses = opts.repeats ?? 1;
      const form = chart.sections.flatMap((s) => s.bars.map((b) => stripMelody({ ...b, chords: b.chords.map((c) => ({ ...c })) })));
      const labels: (string | null)[] = [];
      chart.sections.forEach((s) => s.bars.forEach((_, i) => labels.push(i === 0 ? s.label : null)));
      const { bars } = turnBack(form, tgt, meter, tritone);
      const all = Array.from({ length: choruses }, () => bars).flat();
      // Lengths count bars as played: repeats taken, each ending on its own pass.
      const played = formAsPlayed(chart).length;
      const seconds = secondsFor(barsAsPlayed(all).length, meter, chart.tempo);
      const length = seconds ? ` (about ${seconds} seconds at ${chart.tempo})` : "";
      const advice = `A solo chorus: ${choruses > 1 ? `${choruses} times` : "once"} through the ${played}-bar form (as played, repeats taken) over the changes before the head comes in${length}${chart.intro ? "; this tune also has a composed intro" : ""}.`;
      return result(kind, all, true, advice, others, {
        choice: chosen(undefined, choruses),
        labels: Array.from({ length: choruses }, () => labels).flat(),
      });
    }
    case "turnaround": {
      const variant = opts.variant ?? "I-vi-ii-V";
      const progression = turnaround(chart.key, variant, tritone, top.startsOnTonic && isDominantChord(tgt));
      const name = progressionNumerals(progression, chart.key);
      const n = opts.bars ?? (meter.beats % 2 === 0 ? 2 : 4);
      const bars = spread(progression, n, meter);
      const advice = top.startsOnTonic
        ? `A ${name} turnaround, ${chords(progression)}, leading to ${topName} at the top.`
        : `A ${name} turnaround lands on ${r.note(parseKey(chart.key).tonic)}, but this tune starts on ${topName} (${prettyNumeral(top.numeral)}), not the tonic. A ii–V into ${topName} or a dominant pedal fits better.`;
      // Played once unless asked: then no repeat signs are drawn (the picker's "Times through" reads 1).
      return result(kind, withRepeats(bars, opts.repeats ?? 1), top.startsOnTonic, advice, others, { choice: chosen(n, opts.repeats ?? 1, { variant }), name });
    }
    case "two-five": {
      const pair = twoFiveInto(formatChord({ ...tgt, bass: null }), tritone);
      const n = opts.bars ?? 2;
      const bars = spread(pair, n, meter);
      const advice = `${isMinorChord(tgt) ? "A minor iiø–V" : "A ii–V"} into ${topName}: ${chords(pair, " | ")}.`;
      return result(kind, withRepeats(bars, opts.repeats ?? 1), true, advice, others, { choice: chosen(n, opts.repeats ?? 1) });
    }
    case "composed": {
      if (!chart.intro) {
        const advice = `This chart has no composed intro (an "Intro:" section in the chart text). ${top.startsOnTonic ? "It starts on the tonic, so a turnaround or a dominant pedal works." : `It starts on ${topName} (${prettyNumeral(top.numeral)}), so a ii–V into bar 1 or a dominant pedal works.`}`;
        return result(kind, [], false, advice, others.filter((k) => k !== "composed"), { choice });
      }
      return composedIntro(chart, opts, tritone, others, choice);
    }
  }
}

const prettyNumeral = (n: string) => n.replace(/^b/, "♭").replace(/^#/, "♯");

function composedIntro(chart: Chart, opts: IntroOptions, tritone: boolean, others: IntroKind[], choice: IntroChoice): IntroResult {
  const bars = chart.intro!.bars.map((b) => ({ ...b, chords: b.chords.map((c) => ({ ...c })) }));
  const played = barsAsPlayed(bars).length;
  const advice = `The tune's own ${played}-bar intro, as written${tritone ? " (tritone substitution is not applied to a composed intro)" : ""}.`;
  return result("composed", withRepeats(bars, opts.repeats ?? 1), true, advice, others, { choice });
}

/** A chart with no chords yet: nothing can lead into bar 1, and no kind is offered instead. */
function withoutChords(chart: Chart, kind: IntroKind, choice: IntroChoice, repeats: number): IntroResult {
  if (kind === "composed" && chart.intro) return composedIntro(chart, { kind, repeats }, false, [], choice);
  const advice =
    kind === "composed"
      ? `This chart has no composed intro, and its form has no chords yet, so no intro can be worked out. Add the chords first.`
      : `The form has no chords yet, so there is nothing for this intro to lead into. Add the chords first.`;
  return result(kind, [], false, advice, [], { choice });
}

function vampIntro(chart: Chart, opts: IntroOptions, tgt: ChordTones, topName: string, others: IntroKind[], r: IntroReader): IntroResult {
  const meter = chart.meter;
  const tritone = opts.tritoneSub ?? false;
  const base: IntroChoice = { kind: "vamp", ...(tritone ? { tritoneSub: true } : {}) };
  const chosen = (bars: number, repeats: number, extra: Partial<IntroChoice>): IntroChoice => ({ ...base, bars, repeats, ...extra });
  const given = opts.vamp ? ([...opts.vamp] as [string, string]) : null;
  const better = suggestedVamp(tgt, chart);
  let pair: [string, string];
  try {
    pair = (given ?? better).map((s) => formatChord(parseChord(s))) as [string, string];
  } catch (e) {
    // An unreadable chord is never guessed at: no bars, and the reason in the advice.
    if (!(e instanceof ChordSymbolError)) throw e;
    return result("vamp", [], false, `${e.message}. Try ${better.map(r.chord).join(" | ")}.`, others, { choice: chosen(opts.bars ?? 2, opts.repeats ?? 2, { vamp: better }) });
  }
  const played = pair.map((s) => (tritone && dominantInto(s, tgt) ? tritoneSubstitute(s) : s));
  const n = opts.bars ?? 2;
  const cells = Array.from({ length: Math.max(n, 2) }, (_, i) => played[i % 2]!);
  const bars = n === 1 && meter.beats >= 2 ? [barOf(played, meter)] : cells.map((c) => barOf([c], meter));
  // A dominant of bar 1 may bring outside notes (its tensions); any other chord with two or more
  // notes foreign to the key and to bar 1 pulls the band toward another key.
  const clashes = played
    .filter((s) => !dominantInto(s, tgt))
    .map((s) => ({ s, foreign: foreignNotes(s, chart, tgt) }))
    .filter((x) => x.foreign.length >= 2);
  const fits = clashes.length === 0;
  const alternative = better.join(" | ") === pair.join(" | ") ? "" : `${better.map(r.chord).join(" | ")} or `;
  // A vamp with no count asked for goes round until the leader cues the top.
  const counted = opts.repeats !== undefined && opts.repeats > 2;
  const shown = played.map(r.chord).join(" | ");
  const advice = fits
    ? `A two-chord vamp, ${shown}, ${counted ? `${opts.repeats} times` : "until the cue"}, then ${topName} at the top.`
    : `The vamp ${shown} clashes with ${topName} in bar 1: ${clashes.map((c) => `${r.chord(c.s)} brings ${c.foreign.map(r.note).join(", ")}`).join("; ")}, notes foreign to ${r.key(chart.key)} and to bar 1. Try ${alternative}a ii–V into bar 1.`;
  return result("vamp", withRepeats(bars, opts.repeats ?? 2), fits, advice, others, {
    choice: chosen(n, opts.repeats ?? 2, { vamp: pair }),
    vamp: pair,
    ...(counted ? {} : { cue: "till cue" as const }),
  });
}

function stripMelody(b: Bar): Bar {
  const out = { ...b };
  delete out.melody;
  return out;
}

/** Every kind of intro for this tune with default options and its fit, for an intro picker. */
export function suggestIntros(chart: Chart, read?: IntroReader): IntroResult[] {
  return INTRO_KINDS.map((kind) => generateIntro(chart, { kind, ...(read ? { read } : {}) }));
}
