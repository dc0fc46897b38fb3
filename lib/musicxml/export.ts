// The chart model → MusicXML 4.0 partwise text, in concert pitch or written for a transposing
// instrument with <transpose> (what must be added to the written pitch to sound: MusicXML 4.0).
import type { Bar, Chart, MelodyNote, Section } from "@/lib/chart/model";
import { symbolToHarmony, type Harmony } from "./kinds";
import {
  fifthsOfKey, letterDistance, moveBetweenKeys, parseKey, parseScientific, shift, shiftPitch,
  simplifyPitch, transposeKey, type KeyName, type Spelled, type Transposition,
} from "./pitch";
import { esc } from "./xml";

export interface ExportOptions {
  /** The instrument's MusicXML transpose (written → sounding); none for concert. */
  transpose?: Transposition | null;
  clef?: "treble" | "bass" | "treble-8vb";
  partName?: string;
}

/** Divisions per quarter: enough for 16ths, dots and bars shared by three chords. */
const DIV = 48;
const TYPE_NAME: Record<MelodyNote["duration"], string> = { w: "whole", h: "half", q: "quarter", "8": "eighth", "16": "16th" };
const QUARTERS: Record<MelodyNote["duration"], number> = { w: 4, h: 2, q: 1, "8": 0.5, "16": 0.25 };

function noteQuarters(n: MelodyNote): number {
  return QUARTERS[n.duration] * (2 - 1 / 2 ** (n.dots ?? 0));
}

function restType(quarters: number): { type: string; dots: number } | null {
  for (const [d, base] of Object.entries(QUARTERS) as [MelodyNote["duration"], number][]) {
    for (const dots of [0, 1]) if (Math.abs(base * (2 - 1 / 2 ** dots) - quarters) < 1e-6) return { type: TYPE_NAME[d], dots };
  }
  return null;
}

const step = (p: Spelled, tag: "root" | "bass") =>
  `<${tag}-step>${p.step}</${tag}-step>${p.alter ? `<${tag}-alter>${p.alter}</${tag}-alter>` : ""}`;

function harmonyXml(symbol: string, move: (p: Spelled) => Spelled, offsetDiv: number): string {
  const h: Harmony | null = symbolToHarmony(symbol);
  const offset = offsetDiv ? `<offset>${offsetDiv}</offset>` : "";
  if (!h) {
    const root = /^([A-G])(#|b)?/.exec(symbol);
    if (!root) return "";
    const r = move({ step: root[1] as Spelled["step"], alter: root[2] === "#" ? 1 : root[2] === "b" ? -1 : 0 });
    return `<harmony><root>${step(r, "root")}</root><kind text="${esc(symbol.slice(root[0].length))}">other</kind>${offset}</harmony>`;
  }
  if (h.kind === "none" || !h.root) return `<harmony><root><root-step>C</root-step></root><kind text="N.C.">none</kind>${offset}</harmony>`;
  const degrees = h.degrees
    .map((d) => `<degree><degree-value>${d.value}</degree-value><degree-alter>${d.alter}</degree-alter><degree-type>${d.type}</degree-type></degree>`)
    .join("");
  const text = h.text ? ` text="${esc(h.text)}"` : "";
  const bass = h.bass ? `<bass>${step(move(h.bass), "bass")}</bass>` : "";
  return `<harmony><root>${step(move(h.root), "root")}</root><kind${text}>${h.kind}</kind>${bass}${degrees}${offset}</harmony>`;
}

interface Ctx {
  concert: KeyName;
  written: KeyName;
  t: Transposition | null;
  letters: number;
  barDiv: number;
}

function pitchXml(pitch: string, ctx: Ctx): string {
  const p = parseScientific(pitch);
  if (!p) return "<rest/>";
  const oct = ctx.t?.octaveChange ?? 0;
  const w = ctx.t ? simplifyPitch(shiftPitch(p, ctx.letters - 7 * oct, -ctx.t.chromatic - 12 * oct), fifthsOfKey(ctx.written) < 0) : p;
  return `<pitch><step>${w.step}</step>${w.alter ? `<alter>${w.alter}</alter>` : ""}<octave>${w.octave}</octave></pitch>`;
}

function notesXml(bar: Bar, ctx: Ctx, move: (p: Spelled) => Spelled, quarterPerBeat: number, tiedIn: boolean): { xml: string; tieOut: boolean } {
  const chords = [...bar.chords].sort((a, b) => a.beat - b.beat).map((c) => ({ pos: Math.round(c.beat * quarterPerBeat * DIV), symbol: c.symbol }));
  const out: string[] = [];
  let pos = 0;
  let ci = 0;
  const harmoniesBefore = (end: number) => {
    while (ci < chords.length && (chords[ci]?.pos ?? 0) < end) {
      const c = chords[ci++] as { pos: number; symbol: string };
      out.push(harmonyXml(c.symbol, move, Math.max(0, c.pos - pos)));
    }
  };
  const melody = bar.simile ? undefined : bar.melody;
  let tie = tiedIn;
  if (melody && melody.length) {
    for (const n of melody) {
      const dur = Math.round(noteQuarters(n) * DIV);
      harmoniesBefore(pos + dur);
      const ties = [tie ? `<tie type="stop"/>` : "", n.tie ? `<tie type="start"/>` : ""].join("");
      const tied = [tie ? `<tied type="stop"/>` : "", n.tie ? `<tied type="start"/>` : ""].join("");
      const dots = "<dot/>".repeat(n.dots ?? 0);
      out.push(`<note>${n.pitch ? pitchXml(n.pitch, ctx) : "<rest/>"}<duration>${dur}</duration>${ties}<voice>1</voice><type>${TYPE_NAME[n.duration]}</type>${dots}${tied ? `<notations>${tied}</notations>` : ""}</note>`);
      tie = n.tie && !!n.pitch;
      pos += dur;
    }
    harmoniesBefore(Number.POSITIVE_INFINITY);
    return { xml: out.join(""), tieOut: tie };
  }
  if (chords.length <= 1 && (chords[0]?.pos ?? 0) === 0) {
    harmoniesBefore(Number.POSITIVE_INFINITY);
    out.push(`<note print-object="no"><rest measure="yes"/><duration>${ctx.barDiv}</duration><voice>1</voice></note>`);
    return { xml: out.join(""), tieOut: false };
  }
  // Chords only: an invisible rest under each chord carries it to its beat, as notation programs expect.
  const stops = [...chords.map((c) => c.pos), ctx.barDiv];
  if ((stops[0] ?? 0) > 0) stops.unshift(0);
  for (let i = 0; i < stops.length - 1; i++) {
    const from = stops[i] as number;
    const to = stops[i + 1] as number;
    if (to <= from) continue;
    harmoniesBefore(from + 1);
    const rt = restType((to - from) / DIV);
    out.push(rt
      ? `<note print-object="no"><rest/><duration>${to - from}</duration><voice>1</voice><type>${rt.type}</type>${"<dot/>".repeat(rt.dots)}</note>`
      : `<forward><duration>${to - from}</duration></forward>`);
    pos = to;
  }
  return { xml: out.join(""), tieOut: false };
}

function barlines(bar: Bar, prev: Bar | undefined, next: Bar | undefined, sectionEnd: boolean, last: boolean): { left: string; right: string } {
  let left = "";
  const endingStarts = bar.ending !== null && prev?.ending !== bar.ending;
  if (bar.repeatStart || endingStarts) {
    left = `<barline location="left">${endingStarts ? `<ending number="${bar.ending}" type="start"/>` : ""}${bar.repeatStart ? `<repeat direction="forward"/>` : ""}</barline>`;
  }
  const endingStops = bar.ending !== null && next?.ending !== bar.ending;
  const style = last ? "light-heavy" : sectionEnd ? "light-light" : bar.repeatEnd ? "light-heavy" : "";
  let right = "";
  if (style || endingStops || bar.repeatEnd) {
    const ending = endingStops ? `<ending number="${bar.ending}" type="${bar.repeatEnd || next?.ending ? "stop" : "discontinue"}"/>` : "";
    const times = bar.repeatTimes ? ` times="${bar.repeatTimes}"` : "";
    right = `<barline location="right">${style ? `<bar-style>${style}</bar-style>` : ""}${ending}${bar.repeatEnd ? `<repeat direction="backward"${times}/>` : ""}</barline>`;
  }
  return { left, right };
}

export function exportMusicXml(chart: Chart, opts: ExportOptions = {}): string {
  const concert = parseKey(chart.key) ?? { tonic: { step: "C", alter: 0 }, minor: false };
  const t = opts.transpose && (opts.transpose.diatonic || opts.transpose.chromatic || opts.transpose.octaveChange) ? opts.transpose : null;
  const written = t && (t.diatonic || t.chromatic) ? transposeKey(concert, -t.diatonic, -t.chromatic) : concert;
  const expected = shift(concert.tonic, -(t?.diatonic ?? 0), -(t?.chromatic ?? 0));
  const adj = ((letterDistance(expected, written.tonic) + 3) % 7) - 3;
  const quarterPerBeat = 4 / chart.meter.unit;
  const ctx: Ctx = { concert, written, t, letters: -(t?.diatonic ?? 0) + adj, barDiv: Math.round(chart.meter.beats * quarterPerBeat * DIV) };
  const move = (p: Spelled) => (t && (t.diatonic || t.chromatic) ? moveBetweenKeys(p, concert, written) : p);
  const sections: Section[] = [...(chart.intro ? [{ ...chart.intro, label: /^intro/i.test(chart.intro.label) ? chart.intro.label : "Intro" }] : []), ...chart.sections];
  const bars = sections.flatMap((s, si) => s.bars.map((bar, bi) => ({ bar, section: bi === 0 ? s.label : null, sectionEnd: bi === s.bars.length - 1, si })));
  const clef = opts.clef === "bass" ? "<clef><sign>F</sign><line>4</line></clef>"
    : opts.clef === "treble-8vb" ? "<clef><sign>G</sign><line>2</line><clef-octave-change>-1</clef-octave-change></clef>"
    : "<clef><sign>G</sign><line>2</line></clef>";
  const transpose = t
    ? `<transpose><diatonic>${t.diatonic}</diatonic><chromatic>${t.chromatic}</chromatic>${t.octaveChange ? `<octave-change>${t.octaveChange}</octave-change>` : ""}</transpose>`
    : "";
  const measures: string[] = [];
  let tie = false;
  bars.forEach(({ bar, section, sectionEnd }, i) => {
    const prev = bars[i - 1]?.bar;
    const next = bars[i + 1]?.bar;
    const parts: string[] = [];
    const { left, right } = barlines(bar, prev, next, sectionEnd, i === bars.length - 1);
    parts.push(left);
    const style = bar.simile && !prev?.simile ? `<measure-style><measure-repeat type="start">1</measure-repeat></measure-style>`
      : !bar.simile && prev?.simile ? `<measure-style><measure-repeat type="stop"/></measure-style>` : "";
    if (i === 0) {
      parts.push(`<attributes><divisions>${DIV}</divisions><key><fifths>${fifthsOfKey(written)}</fifths><mode>${written.minor ? "minor" : "major"}</mode></key><time><beats>${chart.meter.beats}</beats><beat-type>${chart.meter.unit}</beat-type></time>${clef}${transpose}${style}</attributes>`);
    } else if (style) parts.push(`<attributes>${style}</attributes>`);
    if (section) parts.push(`<direction placement="above"><direction-type><rehearsal>${esc(section)}</rehearsal></direction-type></direction>`);
    if (i === 0 && chart.feel) parts.push(`<direction placement="above"><direction-type><words>${esc(chart.feel)}</words></direction-type></direction>`);
    if (i === 0 && chart.tempo) {
      const unit = chart.meter.unit === 2 ? "half" : chart.meter.unit === 8 ? "eighth" : "quarter";
      parts.push(`<direction placement="above"><direction-type><metronome><beat-unit>${unit}</beat-unit><per-minute>${chart.tempo}</per-minute></metronome></direction-type><sound tempo="${chart.tempo * quarterPerBeat}"/></direction>`);
    }
    const notes = notesXml(bar, ctx, move, quarterPerBeat, tie);
    tie = notes.tieOut;
    parts.push(notes.xml, right);
    measures.push(`    <measure number="${i + 1}">${parts.join("")}</measure>`);
  });
  const composer = chart.composer ? `<creator type="composer">${esc(chart.composer)}</creator>` : "";
  return [
    `<?xml version="1.0" encoding="UTF-8" standalone="no"?>`,
    `<!DOCTYPE score-partwise PUBLIC "-//Recordare//DTD MusicXML 4.0 Partwise//EN" "http://www.musicxml.org/dtds/partwise.dtd">`,
    `<score-partwise version="4.0">`,
    `  <work><work-title>${esc(chart.title)}</work-title></work>`,
    `  <identification>${composer}<encoding><software>Pedalpoint</software><supports element="transpose" type="yes"/></encoding></identification>`,
    `  <part-list><score-part id="P1"><part-name>${esc(opts.partName ?? "Lead sheet")}</part-name></score-part></part-list>`,
    `  <part id="P1">`,
    ...measures,
    `  </part>`,
    `</score-partwise>`,
    "",
  ].join("\n");
}
