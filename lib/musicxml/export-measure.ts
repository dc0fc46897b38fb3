// One bar of the chart model → the inside of a MusicXML <measure>: <harmony> chord symbols, the melody
// (or invisible rests carrying the chords to their beats) and the barlines.
import type { Bar, MelodyNote } from "@/lib/chart/model";
import { endingNumberText, sameEnding } from "@/lib/chart/endings";
import { symbolToHarmony, type Harmony } from "./kinds";
import { fifthsOfKey, parseScientific, shiftPitch, simplifyPitch, type KeyName, type Spelled, type Transposition } from "./pitch";
import { esc } from "./xml";

/** Divisions per quarter: enough for 16ths, dots and bars shared by three chords. */
export const DIV = 48;
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
  // MusicXML 4.0, kind "none": the root is required by the schema, so its text is the empty string and
  // the kind's own text is what a reader shows.
  if (h.kind === "none" || !h.root) return `<harmony><root><root-step text="">C</root-step></root><kind text="N.C.">none</kind>${offset}</harmony>`;
  const degrees = h.degrees
    .map((d) => `<degree><degree-value>${d.value}</degree-value><degree-alter>${d.alter}</degree-alter><degree-type>${d.type}</degree-type></degree>`)
    .join("");
  const text = h.text ? ` text="${esc(h.text)}"` : "";
  const bass = h.bass ? `<bass>${step(move(h.bass), "bass")}</bass>` : "";
  return `<harmony><root>${step(move(h.root), "root")}</root><kind${text}>${h.kind}</kind>${bass}${degrees}${offset}</harmony>`;
}

export interface MeasureCtx {
  written: KeyName;
  /** The <transpose> written in the file (the drawn melody octave folded in), null for none. */
  t: Transposition | null;
  /** Letters to move a concert pitch to the written one (the key's respelling included). */
  letters: number;
  move: (p: Spelled) => Spelled;
  quarterPerBeat: number;
}

function pitchXml(pitch: string, ctx: MeasureCtx): string {
  const p = parseScientific(pitch);
  if (!p) return "<rest/>";
  const oct = ctx.t?.octaveChange ?? 0;
  const w = ctx.t ? simplifyPitch(shiftPitch(p, ctx.letters - 7 * oct, -ctx.t.chromatic - 12 * oct), fifthsOfKey(ctx.written) < 0) : p;
  return `<pitch><step>${w.step}</step>${w.alter ? `<alter>${w.alter}</alter>` : ""}<octave>${w.octave}</octave></pitch>`;
}

/** The notes of a bar: melody when it has one, else invisible rests under each chord. */
export function notesXml(bar: Bar, ctx: MeasureCtx, barDiv: number, tiedIn: boolean): { xml: string; tieOut: boolean } {
  const chords = [...bar.chords].sort((a, b) => a.beat - b.beat).map((c) => ({ pos: Math.round(c.beat * ctx.quarterPerBeat * DIV), symbol: c.symbol }));
  const out: string[] = [];
  let pos = 0;
  let ci = 0;
  const harmoniesBefore = (end: number) => {
    while (ci < chords.length && (chords[ci]?.pos ?? 0) < end) {
      const c = chords[ci++] as { pos: number; symbol: string };
      out.push(harmonyXml(c.symbol, ctx.move, Math.max(0, c.pos - pos)));
    }
  };
  let tie = tiedIn;
  if (bar.melody && bar.melody.length) {
    for (const n of bar.melody) {
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
  if (chords.length <= 1 && (chords[0]?.pos ?? 0) === 0 && !bar.pickup) {
    harmoniesBefore(Number.POSITIVE_INFINITY);
    out.push(`<note print-object="no"><rest measure="yes"/><duration>${barDiv}</duration><voice>1</voice></note>`);
    return { xml: out.join(""), tieOut: false };
  }
  // Chords only: an invisible rest under each chord carries it to its beat, as notation programs expect.
  const stops = [...chords.map((c) => c.pos), barDiv];
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

/** Left and right <barline> of a bar: repeats, endings, and the double/final bar at section ends. */
export function barlines(bar: Bar, prev: Bar | undefined, next: Bar | undefined, sectionEnd: boolean, last: boolean): { left: string; right: string } {
  let left = "";
  const endingStarts = bar.ending !== null && (!sameEnding(prev, bar) || prev?.repeatEnd === true || bar.repeatStart);
  if (bar.repeatStart || endingStarts) {
    left = `<barline location="left">${endingStarts ? `<ending number="${endingNumberText(bar)}" type="start"/>` : ""}${bar.repeatStart ? `<repeat direction="forward"/>` : ""}</barline>`;
  }
  const endingStops = bar.ending !== null && (!sameEnding(next, bar) || bar.repeatEnd || next?.repeatStart === true);
  const style = last ? "light-heavy" : bar.repeatEnd ? "light-heavy" : sectionEnd ? "light-light" : "";
  let right = "";
  if (style || endingStops || bar.repeatEnd) {
    const ending = endingStops ? `<ending number="${endingNumberText(bar)}" type="${bar.repeatEnd || next?.ending ? "stop" : "discontinue"}"/>` : "";
    const times = bar.repeatTimes ? ` times="${bar.repeatTimes}"` : "";
    right = `<barline location="right">${style ? `<bar-style>${style}</bar-style>` : ""}${ending}${bar.repeatEnd ? `<repeat direction="backward"${times}/>` : ""}</barline>`;
  }
  return { left, right };
}
