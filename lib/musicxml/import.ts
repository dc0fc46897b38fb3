// MusicXML (partwise) → the chart model, with a report of what was read and what was left out.
// Harmonies come from the first part that has any, the melody from the first part; a transposing
// part (<transpose>) is read back to concert pitch.
import type { Bar, Chart, ChordSlot, MelodyNote, Section } from "@/lib/chart/model";
import { approximationOf, harmonyToSymbol, KIND_FALLBACK, type Harmony } from "./kinds";
import {
  fifthsOfKey, formatKey, formatScientific, keyFromFifths, letterDistance, shift, shiftPitch,
  simplify, simplifyPitch, transposeKey, type KeyName, type Pitch, type Transposition,
} from "./pitch";
import { bump, readPart, type RawMeasure, type RawNote, type Tally } from "./read-part";
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
  /** Plain sentences: what was left out, with counts. */
  skipped: string[];
}

export interface ImportOptions {
  fileName?: string;
  /** Brings a symbol to house style; null when the house parser cannot read it. */
  normalizeChord?: (symbol: string) => string | null;
}

export interface ImportResult {
  chart: Chart;
  report: ImportReport;
}

const TYPE_CODE: Record<string, MelodyNote["duration"]> = { whole: "w", half: "h", quarter: "q", eighth: "8", "16th": "16" };
const QUARTERS: Record<MelodyNote["duration"], number> = { w: 4, h: 2, q: 1, "8": 0.5, "16": 0.25 };

function durationFromQuarters(q: number): { duration: MelodyNote["duration"]; dots: number } | null {
  for (const [d, base] of Object.entries(QUARTERS) as [MelodyNote["duration"], number][]) {
    for (const dots of [0, 1, 2]) {
      const total = base * (2 - 1 / 2 ** dots);
      if (Math.abs(total - q) < 1e-6) return { duration: d, dots };
    }
  }
  return null;
}

/** Beats snap to 1/48 so thirds and 16ths come back as the same numbers they left as. */
function round(n: number): number {
  return Math.round(n * 48) / 48;
}

interface PartView {
  el: XNode;
  name: string;
  measures: RawMeasure[];
}

/** How a written part maps to concert pitch, with the letters adjusted when the key is respelled. */
function concertMapping(m: RawMeasure | undefined) {
  const t: Transposition = m?.transpose ?? { diatonic: 0, chromatic: 0, octaveChange: 0 };
  const written: KeyName = keyFromFifths(m?.fifths ?? 0, m?.minor ?? false);
  const plain = t.diatonic === 0 && t.chromatic === 0;
  const concert = plain ? written : transposeKey(written, t.diatonic, t.chromatic);
  const expected = shift(written.tonic, t.diatonic, t.chromatic);
  const adj = ((letterDistance(expected, concert.tonic) + 3) % 7) - 3;
  const oct = t.octaveChange ?? 0;
  return {
    t, written, concert, plain,
    root: (p: Harmony["root"]) => (p ? simplify(plain ? p : shift(p, t.diatonic + adj, t.chromatic), fifthsOfKey(concert) < 0) : p),
    pitch: (p: Pitch): Pitch => {
      if (plain && oct === 0) return p;
      return simplifyPitch(shiftPitch(p, t.diatonic + adj + 7 * oct, t.chromatic + 12 * oct), fifthsOfKey(concert) < 0);
    },
  };
}

function chordSlots(m: RawMeasure, barBeats: number, quarterPerBeat: number, toSymbol: (h: Harmony) => string | null): ChordSlot[] {
  const hs = m.harmonies.flatMap((h) => {
    const symbol = toSymbol(h.harmony);
    return symbol ? [{ pos: h.pos, symbol }] : [];
  });
  if (hs.length === 0) return [];
  const distinct = new Set(hs.map((h) => h.pos)).size === hs.length;
  const starts = distinct
    ? hs.map((h) => Math.min(round(h.pos / quarterPerBeat), barBeats - 1 / 48))
    : hs.map((_, i) => round((barBeats / hs.length) * i));
  return hs.map((h, i) => {
    const beat = starts[i] ?? 0;
    const next = starts[i + 1] ?? barBeats;
    return { symbol: h.symbol, beat: round(beat), beats: Math.max(1 / 48, round(next - beat)) };
  });
}

function melodyOf(notes: RawNote[], toConcert: (p: Pitch) => Pitch, skipped: Tally): MelodyNote[] {
  const out: MelodyNote[] = [];
  for (const n of notes) {
    let dur: { duration: MelodyNote["duration"]; dots: number } | null = null;
    if (n.type && TYPE_CODE[n.type]) dur = { duration: TYPE_CODE[n.type] as MelodyNote["duration"], dots: Math.min(2, n.dots) };
    else if (!n.type) dur = durationFromQuarters(n.quarters);
    if (!dur) {
      bump(skipped, "melody notes shorter than a 16th or longer than a whole note");
      continue;
    }
    if (out.length >= 64) {
      bump(skipped, "melody notes beyond 64 in one bar");
      continue;
    }
    out.push({ pitch: n.pitch ? formatScientific(toConcert(n.pitch)) : null, duration: dur.duration, dots: dur.dots, tie: n.tie });
  }
  return out;
}

function titleOf(root: XNode, fileName?: string): string {
  const t = textOf(child(root, "work"), "work-title") || textOf(root, "movement-title");
  const fromFile = fileName?.replace(/\.(musicxml|xml|mxl)$/i, "").trim();
  return (t || fromFile || "Untitled import").slice(0, 200);
}

export function importMusicXml(root: XNode, opts: ImportOptions = {}): ImportResult {
  if (root.name === "score-timewise") {
    throw new MusicXmlError("unsupported", "This is a timewise MusicXML file. Export it as partwise MusicXML (the usual kind) and try again.");
  }
  if (root.name !== "score-partwise") {
    throw new MusicXmlError("not_musicxml", `This XML file is not a MusicXML score (its root element is <${root.name}>).`);
  }
  const skipped: Tally = new Map();
  const read: string[] = [];
  const names = new Map(children(child(root, "part-list"), "score-part").map((sp) => [sp.attrs.id ?? "", textOf(sp, "part-name") ?? ""]));
  const parts: PartView[] = children(root, "part").map((el) => ({ el, name: names.get(el.attrs.id ?? "") || el.attrs.id || "Part", measures: [] }));
  if (parts.length === 0) throw new MusicXmlError("not_musicxml", "This MusicXML file has no parts with measures.");
  const melodyPart = parts[0] as PartView;
  melodyPart.measures = readPart(melodyPart.el, skipped);
  let chordPart = melodyPart;
  if (!melodyPart.measures.some((m) => m.harmonies.length)) {
    for (const p of parts.slice(1)) {
      const ms = readPart(p.el, new Map());
      if (ms.some((m) => m.harmonies.length)) {
        p.measures = ms;
        chordPart = p;
        break;
      }
    }
  }
  if (parts.length > 1) {
    const others = parts.filter((p) => p !== melodyPart && p !== chordPart).map((p) => `"${p.name}"`);
    if (others.length) skipped.set(`other parts: ${others.join(", ")}`, 0);
  }
  const first = melodyPart.measures[0];
  if (!first) throw new MusicXmlError("not_musicxml", "The first part of this MusicXML file has no measures.");
  const melodyMap = concertMapping(first);
  const chordMap = chordPart === melodyPart ? melodyMap : concertMapping(chordPart.measures[0]);
  const key = melodyMap.concert;
  const keyName = formatKey(key);

  let meter = { beats: first.beats, unit: first.beatType };
  if (!Number.isInteger(meter.beats) || meter.beats < 1 || meter.beats > 16 || ![2, 4, 8].includes(meter.unit)) {
    skipped.set(`time signature ${meter.beats}/${meter.unit}, read as 4/4`, 0);
    meter = { beats: 4, unit: 4 };
  }
  const normalizeCache = new Map<string, string | null>();
  const toSymbol = (h: Harmony): string | null => {
    const concertH: Harmony = { ...h, root: chordMap.root(h.root), bass: h.bass ? chordMap.root(h.bass) ?? undefined : undefined };
    if (!concertH.bass) delete concertH.bass;
    const approx = approximationOf(h.kind);
    if (approx) bump(skipped, `classical chord kinds read loosely: ${approx}`);
    const sym = harmonyToSymbol(concertH);
    if (!opts.normalizeChord) return sym;
    if (!normalizeCache.has(sym)) {
      let n = opts.normalizeChord(sym);
      const fallbackKind = KIND_FALLBACK[h.kind];
      const tries = [
        harmonyToSymbol({ ...concertH, degrees: [] }),
        ...(fallbackKind ? [harmonyToSymbol({ ...concertH, kind: fallbackKind, degrees: [] })] : []),
      ];
      for (const plain of tries) {
        if (n !== null) break;
        n = opts.normalizeChord(plain);
        if (n !== null) bump(skipped, `chord additions Pedalpoint cannot show (${sym} read as ${n})`);
      }
      if (n === null) bump(skipped, `chord symbols Pedalpoint cannot read (${sym}), left out`);
      normalizeCache.set(sym, n);
    }
    return normalizeCache.get(sym) ?? null;
  };

  const barBeats = meter.beats;
  const quarterPerBeat = 4 / meter.unit;
  const hasPitches = melodyPart.measures.some((m) => m.notes.some((n) => n.pitch));
  const sections: Section[] = [];
  let current: Section | null = null;
  let ending: number | null = null;
  let simile = false;
  let chords = 0;
  let melodyNotes = 0;
  let tempo: number | null = null;
  let feel = "";
  let keyChanges = 0;
  let timeChanges = 0;
  const count = Math.max(melodyPart.measures.length, chordPart.measures.length);
  for (let i = 0; i < count; i++) {
    const m = melodyPart.measures[i];
    const cm = chordPart.measures[i];
    if (!m) break;
    if (i > 0 && (m.fifths !== first.fifths || m.minor !== first.minor) && (m.fifths !== melodyPart.measures[i - 1]?.fifths)) keyChanges++;
    if (i > 0 && (m.beats !== melodyPart.measures[i - 1]?.beats || m.beatType !== melodyPart.measures[i - 1]?.beatType)) timeChanges++;
    if (m.rehearsal || !current) {
      const label = (m.rehearsal ?? "A").slice(0, 40);
      if (!current || current.bars.length > 0) {
        current = { label, bars: [] };
        sections.push(current);
      } else current.label = label;
    }
    tempo ??= m.tempo ?? null;
    if (i === 0 && m.words[0]) feel = m.words[0].slice(0, 60);
    if (m.simileStart) simile = true;
    if (m.simileStop) simile = false;
    if (m.endingStart !== undefined) ending = m.endingStart;
    const slots = cm ? chordSlots(cm, barBeats, quarterPerBeat, toSymbol) : [];
    chords += slots.length;
    const bar: Bar = { chords: slots.slice(0, 16), simile, repeatStart: m.repeatStart, repeatEnd: m.repeatEnd, ending };
    if (slots.length > 16) bump(skipped, "chord symbols beyond 16 in one bar", slots.length - 16);
    if (m.repeatTimes) bar.repeatTimes = m.repeatTimes;
    if (hasPitches && m.notes.length) {
      bar.melody = melodyOf(m.notes, melodyMap.pitch, skipped);
      melodyNotes += bar.melody.filter((n) => n.pitch).length;
    }
    if (current.bars.length < 512) current.bars.push(bar);
    else bump(skipped, "bars beyond 512 in one section");
    if (m.endingStop) ending = null;
  }
  if (keyChanges) skipped.set(`key changes (${keyChanges}); the chart keeps the opening key`, 0);
  if (timeChanges) skipped.set(`time-signature changes (${timeChanges}); the chart keeps the opening meter`, 0);

  let intro: Section | null = null;
  if (sections.length > 1 && /^intro/i.test(sections[0]?.label ?? "")) intro = sections.shift() ?? null;
  if (sections.length > 64) {
    skipped.set(`sections beyond 64 (${sections.length - 64})`, 0);
    sections.length = 64;
  }
  const composer = children(child(root, "identification"), "creator").find((c) => c.attrs.type === "composer")?.text ?? "";
  const title = titleOf(root, opts.fileName);
  if (tempo !== null) tempo = Math.min(400, Math.max(20, tempo));
  const chart: Chart = {
    title, composer: composer.slice(0, 200), key: keyName, meter: meter as Chart["meter"], tempo, feel, intro, sections,
  };

  read.push(`Title: ${title}`);
  if (composer) read.push(`Composer: ${composer}`);
  const f = fifthsOfKey(key);
  read.push(`Concert key: ${keyName} (${f === 0 ? "no sharps or flats" : `${Math.abs(f)} ${f > 0 ? "sharp" : "flat"}${Math.abs(f) === 1 ? "" : "s"}`})`);
  if (!melodyMap.plain) {
    read.push(`Part "${melodyPart.name}" is written for a transposing instrument (in ${formatKey(melodyMap.written)}); read back to concert pitch`);
  }
  read.push(`Time: ${meter.beats}/${meter.unit}`);
  if (tempo !== null) read.push(`Tempo: ${tempo}`);
  if (feel) read.push(`Feel: ${feel}`);
  const bars = sections.reduce((n, s) => n + s.bars.length, 0) + (intro?.bars.length ?? 0);
  read.push(`${bars} bars in ${sections.length} section${sections.length === 1 ? "" : "s"}: ${sections.map((s) => s.label).join(", ")}${intro ? " (and an intro)" : ""}`);
  read.push(`${chords} chord symbol${chords === 1 ? "" : "s"}${chordPart !== melodyPart ? ` from part "${chordPart.name}"` : ""}`);
  const all = [...(intro ? [intro] : []), ...sections].flatMap((s) => s.bars);
  const repeats = all.filter((b) => b.repeatEnd).length;
  const endings = new Set(all.filter((b) => b.ending !== null).map((b) => b.ending)).size;
  if (repeats) read.push(`${repeats} repeat${repeats === 1 ? "" : "s"}${endings ? `, ${endings} numbered endings` : ""}`);
  if (hasPitches) read.push(`Melody: ${melodyNotes} notes from part "${melodyPart.name}"`);
  else read.push("No melody notes (chords only)");

  const skippedLines = [...skipped.entries()].map(([what, n]) => (n > 0 ? `${what} (${n})` : what));
  return {
    chart,
    report: {
      title, partName: melodyPart.name, parts: parts.length, measures: bars, chords, melodyNotes,
      sections: sections.map((s) => s.label), read, skipped: skippedLines,
    },
  };
}

