// MusicXML (partwise) → the chart model, with a report of what was read and what was left out.
// Harmonies come from the first part that has any, the melody from the first part; a transposing
// part (<transpose>) is read back to concert pitch measure by measure.
import type { Bar, Chart, Section } from "@/lib/chart/model";
import { endingFields } from "@/lib/chart/endings";
import { concertMappings, sameTransposition } from "./concert";
import { fitToChartText } from "./fit";
import { chordSlots, melodyOf, round, settleSimile, tempoInMeterBeats, unitWords } from "./import-bars";
import { approximationOf, harmonyToSymbol, KIND_FALLBACK, type Harmony } from "./kinds";
import { fifthsOfKey, formatKey, parseKey } from "./pitch";
import { readPart, type RawMeasure } from "./read-part";
import { Skipped } from "./report";
import { child, children, MusicXmlError, textOf, type XNode } from "./xml";

export interface ImportReport {
  title: string;
  partName: string;
  parts: number;
  measures: number;
  chords: number;
  melodyNotes: number;
  sections: string[];
  /** Plain sentences: what was read. */
  read: string[];
  /** Plain sentences: what was read but not kept, with counts and bar numbers. */
  skipped: string[];
  /**
   * Plain sentences: bars and chords changed or left out so the chart can be written as chart text
   * (only with `fitChartText`), each naming the bars and the chords.
   */
  changed: string[];
}

export interface ImportOptions {
  fileName?: string;
  /** Brings a symbol to house style; null when the house parser cannot read it. */
  normalizeChord?: (symbol: string) => string | null;
  /**
   * Bend what chart text cannot say (chords between beats, a melody that does not fill its bar,
   * endings without a repeat) into what it can, reporting each change by bar. The import screen
   * saves chart text, so it asks for this; without it the chart is as faithful as the model allows.
   */
  fitChartText?: boolean;
}

export interface ImportResult {
  chart: Chart;
  report: ImportReport;
}

interface PartView {
  el: XNode;
  name: string;
  measures: RawMeasure[];
}

function titleOf(root: XNode, fileName?: string): string {
  const t = textOf(child(root, "work"), "work-title") || textOf(root, "movement-title");
  const fromFile = fileName?.replace(/\.(musicxml|xml|mxl)$/i, "").trim();
  return (t || fromFile || "Untitled import").slice(0, 200);
}

function pickParts(root: XNode, skipped: Skipped): { melodyPart: PartView; chordPart: PartView; parts: PartView[] } {
  const names = new Map(children(child(root, "part-list"), "score-part").map((sp) => [sp.attrs.id ?? "", textOf(sp, "part-name") ?? ""]));
  const parts: PartView[] = children(root, "part").map((el) => ({ el, name: names.get(el.attrs.id ?? "") || el.attrs.id || "Part", measures: [] }));
  if (parts.length === 0) throw new MusicXmlError("not_musicxml", "This MusicXML file has no parts with measures.");
  const melodyPart = parts[0] as PartView;
  melodyPart.measures = readPart(melodyPart.el, skipped);
  let chordPart = melodyPart;
  if (!melodyPart.measures.some((m) => m.harmonies.length)) {
    for (const p of parts.slice(1)) {
      const ms = readPart(p.el, new Skipped());
      if (ms.some((m) => m.harmonies.length)) {
        p.measures = ms;
        chordPart = p;
        break;
      }
    }
  }
  const others = parts.filter((p) => p !== melodyPart && p !== chordPart).map((p) => `"${p.name}"`);
  if (others.length) skipped.note(`other parts: ${others.join(", ")}`);
  return { melodyPart, chordPart, parts };
}

function symbolReader(opts: ImportOptions, skipped: Skipped) {
  const cache = new Map<string, { n: string | null; plain: boolean }>();
  return (concertH: Harmony, original: Harmony, bar: string): string | null => {
    const approx = approximationOf(original.kind);
    if (approx) skipped.add(`classical chord kinds read loosely: ${approx}`, bar);
    const sym = harmonyToSymbol(concertH);
    if (!opts.normalizeChord) return sym;
    let hit = cache.get(sym);
    if (!hit) {
      hit = { n: opts.normalizeChord(sym), plain: false };
      const fallbackKind = KIND_FALLBACK[original.kind];
      const tries = [harmonyToSymbol({ ...concertH, degrees: [] }), ...(fallbackKind ? [harmonyToSymbol({ ...concertH, kind: fallbackKind, degrees: [] })] : [])];
      for (const plain of tries) {
        if (hit.n !== null) break;
        hit = { n: opts.normalizeChord(plain), plain: true };
      }
      cache.set(sym, hit);
    }
    const { n, plain } = hit;
    if (n === null) skipped.add(`chord symbols Pedalpoint cannot read (${sym}), left out`, bar);
    else if (plain) skipped.add(`chord additions Pedalpoint cannot show (${sym} read as ${n})`, bar);
    // house style has one name for the added 2nd/9th: say so rather than rename silently
    else if (/add2/.test(sym) && /add9/.test(n)) skipped.add(`added 2nds written as added 9ths, the one name Pedalpoint uses (${sym} read as ${n})`, bar);
    return n;
  };
}

export function importMusicXml(root: XNode, opts: ImportOptions = {}): ImportResult {
  if (root.name === "score-timewise") {
    throw new MusicXmlError("unsupported", "This is a timewise MusicXML file. Export it as partwise MusicXML (the usual kind) and try again.");
  }
  if (root.name !== "score-partwise") {
    throw new MusicXmlError("not_musicxml", `This XML file is not a MusicXML score (its root element is <${root.name}>).`);
  }
  const skipped = new Skipped();
  const { melodyPart, chordPart, parts } = pickParts(root, skipped);
  const first = melodyPart.measures[0];
  if (!first) throw new MusicXmlError("not_musicxml", "The first part of this MusicXML file has no measures.");
  const hinted = children(child(child(root, "identification"), "miscellaneous"), "miscellaneous-field").find((f) => f.attrs.name === "concert-key")?.text;
  const mapOf = concertMappings(hinted ? parseKey(hinted) : null);
  const key = mapOf(first).concert;
  const keyName = formatKey(key);
  let meter = { beats: first.beats, unit: first.beatType };
  if (!Number.isInteger(meter.beats) || meter.beats < 1 || meter.beats > 16 || ![2, 4, 8].includes(meter.unit)) {
    skipped.note(`time signature ${meter.beats}/${meter.unit}, read as 4/4`);
    meter = { beats: 4, unit: 4 };
  }
  const read: string[] = [];
  const readSymbol = symbolReader(opts, skipped);
  const barBeats = meter.beats;
  const quarterPerBeat = 4 / meter.unit;
  const hasPitches = melodyPart.measures.some((m) => m.notes.some((n) => n.pitch));
  const sections: Section[] = [];
  const barNumbers = new Map<Bar, string>();
  let current: Section | null = null;
  let ending: number[] | null = null;
  let simile = false;
  let lastPlain: Bar | undefined;
  let tempoMark: { quarters: number; unitQuarters: number; perMinute: number; bar: string } | null = null;
  let soundTempo: number | null = null;
  let feel = "";
  for (let i = 0; i < melodyPart.measures.length; i++) {
    const m = melodyPart.measures[i] as RawMeasure;
    const prev = melodyPart.measures[i - 1];
    const cm = chordPart.measures[i];
    const map = mapOf(m);
    if (prev) {
      const prevMap = mapOf(prev);
      if (!sameTransposition(m.transpose, prev.transpose)) read.push(`Bar ${m.number}: the part changes transposition (to ${m.transpose?.diatonic ?? 0}/${m.transpose?.chromatic ?? 0}); followed, still read in concert pitch`);
      if (formatKey(map.concert) !== formatKey(prevMap.concert)) {
        if (map.concert.minor !== prevMap.concert.minor && fifthsOfKey(map.concert) === fifthsOfKey(prevMap.concert)) {
          skipped.add("changes of mode only (major ⇄ minor, same signature); the chart keeps the opening key", m.number);
        } else skipped.add("key changes; the chart keeps the opening key", m.number);
      }
      if (m.beats !== prev.beats || m.beatType !== prev.beatType) skipped.add("time-signature changes; the chart keeps the opening meter", m.number);
      if (m.implicit) skipped.add("measures marked implicit inside the piece (split bars), read as whole bars", m.number);
    }
    if (m.rehearsal || !current) {
      const label = (m.rehearsal ?? "A").slice(0, 40);
      if (!current || current.bars.length > 0) sections.push((current = { label, bars: [] }));
      else current.label = label;
    }
    for (const t of m.tempos) {
      if (!tempoMark) tempoMark = { ...t, bar: m.number };
      else skipped.add("tempo marks after the first; the chart keeps one tempo", m.number);
    }
    if (m.tempo) soundTempo ??= m.tempo;
    if (i === 0 && m.words[0]) feel = m.words[0].slice(0, 60);
    for (const w of m.words.slice(i === 0 ? 1 : 0)) skipped.add(`words above the staff ("${w.slice(0, 30)}")`, m.number);
    for (const s of m.barStyles) {
      const sectionEnd = s === "light-light" && (melodyPart.measures[i + 1]?.rehearsal !== undefined || i === melodyPart.measures.length - 1);
      if (!sectionEnd) skipped.add(`barline styles ("${s}") drawn as plain barlines`, m.number);
    }
    if (m.simileStart) simile = true;
    if (m.simileStop) simile = false;
    if (m.endingStart !== undefined) ending = m.endingStart;
    const cmap = cm ? mapOf(cm) : map;
    const toSymbol = (h: Harmony, bar: string) => {
      const concertH: Harmony = { ...h, root: cmap.root(h.root), bass: h.bass ? cmap.root(h.bass) ?? undefined : undefined };
      if (!concertH.bass) delete concertH.bass;
      return readSymbol(concertH, h, bar);
    };
    const fullQuarters = barBeats * quarterPerBeat;
    // a short first measure is a pickup when the file says so (implicit) or the full bars follow it
    const pickup = i === 0 && m.length > 0 && m.length < fullQuarters - 1e-6 && (m.implicit || melodyPart.measures.length > 1) ? round(m.length / quarterPerBeat) : undefined;
    const slots = cm ? chordSlots(cm, pickup ?? barBeats, quarterPerBeat, toSymbol, skipped) : [];
    const bar: Bar = { chords: slots.slice(0, 16), simile, repeatStart: m.repeatStart, repeatEnd: m.repeatEnd, ...endingFields(ending) };
    if (slots.length > 16) skipped.add("chord symbols beyond 16 in one bar", m.number, slots.length - 16);
    if (m.repeatTimes) bar.repeatTimes = m.repeatTimes;
    if (hasPitches && m.notes.length) bar.melody = melodyOf(m, map.pitch, skipped);
    if (pickup) {
      bar.pickup = pickup;
      read.push(`Bar ${m.number}: a pickup of ${pickup} beat${pickup === 1 ? "" : "s"}`);
    }
    if (simile) settleSimile(bar, lastPlain, m.number, skipped);
    else lastPlain = bar;
    if (current.bars.length < 512) current.bars.push(bar);
    else skipped.add("bars beyond 512 in one section", m.number);
    barNumbers.set(bar, m.number);
    if (m.endingStop) ending = null;
  }
  if (chordPart.measures.length > melodyPart.measures.length) skipped.note(`measures of part "${chordPart.name}" past the end of part "${melodyPart.name}"`);

  let intro: Section | null = null;
  if (sections.length > 1 && /^intro/i.test(sections[0]?.label ?? "")) intro = sections.shift() ?? null;
  if (sections.length > 64) {
    skipped.note(`sections beyond 64 (${sections.length - 64})`);
    sections.length = 64;
  }
  const composer = children(child(root, "identification"), "creator").find((c) => c.attrs.type === "composer")?.text ?? "";
  const title = titleOf(root, opts.fileName);
  const tempo = tempoMark ? tempoInMeterBeats(tempoMark.quarters, meter.unit) : soundTempo ? tempoInMeterBeats(soundTempo, meter.unit) : null;
  const chart: Chart = { title, composer: composer.slice(0, 200), key: keyName, meter: meter as Chart["meter"], tempo, feel, intro, sections };
  const changed = new Skipped();
  if (opts.fitChartText) fitToChartText(chart, barNumbers, changed);

  read.unshift(...headLines(chart, melodyPart, first, mapOf));
  if (tempoMark && tempo !== null) {
    const meterUnit = 4 / meter.unit;
    const compoundDotted = meter.unit === 8 && meter.beats % 3 === 0 && Math.abs(tempoMark.unitQuarters - 1.5) < 1e-6;
    const same = Math.abs(tempoMark.unitQuarters - meterUnit) < 1e-6 || compoundDotted;
    read.push(same ? `Tempo: ${tempo}` : `Tempo: ${tempoMark.perMinute} to the ${unitWords(tempoMark.unitQuarters)}, read as ${tempo} to the ${unitWords(meterUnit)}`);
  } else if (tempo !== null) read.push(`Tempo: ${tempo}`);
  if (feel) read.push(`Feel: ${feel}`);
  const all = [...(intro ? [intro] : []), ...sections].flatMap((s) => s.bars);
  const chords = all.reduce((n, b) => n + b.chords.length, 0);
  const melodyNotes = all.reduce((n, b) => n + (b.melody?.filter((x) => x.pitch).length ?? 0), 0);
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;
  read.push(`${plural(all.length, "bar")} in ${sections.length} section${sections.length === 1 ? "" : "s"}: ${sections.map((s) => s.label).join(", ")}${intro ? " (and an intro)" : ""}`);
  read.push(`${chords} chord symbol${chords === 1 ? "" : "s"}${chordPart !== melodyPart ? ` from part "${chordPart.name}"` : ""}`);
  const repeats = all.filter((b) => b.repeatEnd).length;
  const endings = new Set(all.filter((b) => b.ending !== null).map((b) => b.ending)).size;
  if (repeats) read.push(`${repeats} repeat${repeats === 1 ? "" : "s"}${endings ? `, ${endings} numbered endings` : ""}`);
  read.push(hasPitches ? `Melody: ${plural(melodyNotes, "note")} from part "${melodyPart.name}"` : "No melody notes (chords only)");
  return {
    chart,
    report: {
      title, partName: melodyPart.name, parts: parts.length, measures: all.length, chords, melodyNotes,
      sections: sections.map((s) => s.label), read, skipped: skipped.lines(), changed: changed.lines(),
    },
  };
}

function headLines(chart: Chart, melodyPart: PartView, first: RawMeasure, mapOf: ReturnType<typeof concertMappings>): string[] {
  const out = [`Title: ${chart.title}`];
  if (chart.composer) out.push(`Composer: ${chart.composer}`);
  const key = mapOf(first).concert;
  const f = fifthsOfKey(key);
  out.push(`Concert key: ${chart.key} (${f === 0 ? "no sharps or flats" : `${Math.abs(f)} ${f > 0 ? "sharp" : "flat"}${Math.abs(f) === 1 ? "" : "s"}`})`);
  if (!mapOf(first).plain) out.push(`Part "${melodyPart.name}" is written for a transposing instrument (in ${formatKey(mapOf(first).written)}); read back to concert pitch`);
  out.push(`Time: ${chart.meter.beats}/${chart.meter.unit}`);
  return out;
}
