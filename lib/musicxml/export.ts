// The chart model → MusicXML 4.0 partwise text, in concert pitch or written for a transposing
// instrument with <transpose> (what must be added to the written pitch to sound: MusicXML 4.0).
import type { Bar, Chart, Meter, Section } from "@/lib/chart/model";
import { barlines, DIV, notesXml, type MeasureCtx } from "./export-measure";
import { fifthsOfKey, letterDistance, moveBetweenKeys, parseKey, shift, transposeKey, type Spelled, type Transposition } from "./pitch";
import { esc } from "./xml";

export interface ExportOptions {
  /** The instrument's MusicXML transpose (written → sounding); none for concert. */
  transpose?: Transposition | null;
  clef?: "treble" | "bass" | "treble-8vb";
  partName?: string;
  /**
   * Octaves the part draws its melody away from the plain transposition (a bass-clef or E♭ part: -1).
   * The file is written in that octave and <octave-change> keeps the sounding pitch right.
   */
  melodyOctave?: number;
}

/** One bar to write, with the section it opens and whether it closes one. */
export interface ExportBar {
  bar: Bar;
  section: string | null;
  sectionEnd: boolean;
}

/** The bars of a chart as written: its composed intro, then the form. */
export function chartBars(chart: Chart): ExportBar[] {
  const sections: Section[] = [...(chart.intro ? [{ ...chart.intro, label: /^intro/i.test(chart.intro.label) ? chart.intro.label : "Intro" }] : []), ...chart.sections];
  return sections.flatMap((s) => s.bars.map((bar, bi) => ({ bar, section: bi === 0 ? s.label : null, sectionEnd: bi === s.bars.length - 1 })));
}

/**
 * <metronome> for the chart's tempo, which counts beats of the meter's note value. A compound meter
 * (6/8, 9/8, 12/8) is felt in dotted quarters, so its tempo is written to the dotted quarter when it
 * divides evenly (MusicXML 4.0 <beat-unit-dot/>); <sound tempo> is always quarters per minute.
 */
function metronomeXml(tempo: number, meter: Meter): string {
  const quarters = tempo * (4 / meter.unit);
  const compound = meter.unit === 8 && meter.beats % 3 === 0 && meter.beats > 3 && tempo % 3 === 0;
  const unit = compound ? "quarter" : meter.unit === 2 ? "half" : meter.unit === 8 ? "eighth" : "quarter";
  const perMinute = compound ? tempo / 3 : tempo;
  const dot = compound ? "<beat-unit-dot/>" : "";
  return `<direction placement="above"><direction-type><metronome><beat-unit>${unit}</beat-unit>${dot}<per-minute>${perMinute}</per-minute></metronome></direction-type><sound tempo="${quarters}"/></direction>`;
}

const CLEFS = {
  treble: "<clef><sign>G</sign><line>2</line></clef>",
  bass: "<clef><sign>F</sign><line>4</line></clef>",
  "treble-8vb": "<clef><sign>G</sign><line>2</line><clef-octave-change>-1</clef-octave-change></clef>",
};

/** The transposition written in the file: the instrument's, with the drawn melody octave folded in. */
function fileTransposition(opts: ExportOptions): Transposition | null {
  const t = opts.transpose ?? { diatonic: 0, chromatic: 0, octaveChange: 0 };
  const octaveChange = (t.octaveChange ?? 0) - (opts.melodyOctave ?? 0);
  return t.diatonic || t.chromatic || octaveChange ? { diatonic: t.diatonic, chromatic: t.chromatic, octaveChange } : null;
}

/** A `%` bar carries the music it repeats (MusicXML 4.0 <measure-repeat>: it must be present in each measure). */
function repeatedMusic(bars: ExportBar[], i: number): Bar {
  let j = i;
  while (j > 0 && bars[j]!.bar.simile) j--;
  const source = bars[j]!.bar;
  const bar = bars[i]!.bar;
  // a `%` bar with a melody of its own keeps it; otherwise it carries the melody it repeats
  const melody = bar.melody ?? source.melody;
  return j === i ? bar : { ...bar, chords: source.chords, ...(melody ? { melody } : {}) };
}

/** Writes the given bars (a chart's, or an arrangement's in concert pitch) as a score. */
export function exportBars(chart: Chart, bars: ExportBar[], opts: ExportOptions = {}): string {
  const concert = parseKey(chart.key) ?? { tonic: { step: "C", alter: 0 }, minor: false };
  const t = fileTransposition(opts);
  const written = t && (t.diatonic || t.chromatic) ? transposeKey(concert, -t.diatonic, -t.chromatic) : concert;
  const expected = shift(concert.tonic, -(t?.diatonic ?? 0), -(t?.chromatic ?? 0));
  const adj = ((letterDistance(expected, written.tonic) + 3) % 7) - 3;
  const quarterPerBeat = 4 / chart.meter.unit;
  const move = (p: Spelled) => (t && (t.diatonic || t.chromatic) ? moveBetweenKeys(p, concert, written) : p);
  const ctx: MeasureCtx = { written, t, letters: -(t?.diatonic ?? 0) + adj, move, quarterPerBeat };
  const fullDiv = Math.round(chart.meter.beats * quarterPerBeat * DIV);
  const transpose = t
    ? `<transpose><diatonic>${t.diatonic}</diatonic><chromatic>${t.chromatic}</chromatic>${t.octaveChange ? `<octave-change>${t.octaveChange}</octave-change>` : ""}</transpose>`
    : "";
  const measures: string[] = [];
  let tie = false;
  let number = 1;
  bars.forEach(({ bar, section, sectionEnd }, i) => {
    const prev = bars[i - 1]?.bar;
    const next = bars[i + 1]?.bar;
    const parts: string[] = [];
    const { left, right } = barlines(bar, prev, next, sectionEnd, i === bars.length - 1);
    parts.push(left);
    const style = bar.simile && !prev?.simile ? `<measure-style><measure-repeat type="start">1</measure-repeat></measure-style>`
      : !bar.simile && prev?.simile ? `<measure-style><measure-repeat type="stop"/></measure-style>` : "";
    if (i === 0) {
      parts.push(`<attributes><divisions>${DIV}</divisions><key><fifths>${fifthsOfKey(written)}</fifths><mode>${written.minor ? "minor" : "major"}</mode></key><time><beats>${chart.meter.beats}</beats><beat-type>${chart.meter.unit}</beat-type></time>${CLEFS[opts.clef ?? "treble"]}${transpose}${style}</attributes>`);
    } else if (style) parts.push(`<attributes>${style}</attributes>`);
    if (section) parts.push(`<direction placement="above"><direction-type><rehearsal>${esc(section)}</rehearsal></direction-type></direction>`);
    if (i === 0 && chart.feel) parts.push(`<direction placement="above"><direction-type><words>${esc(chart.feel)}</words></direction-type></direction>`);
    if (i === 0 && chart.tempo) parts.push(metronomeXml(chart.tempo, chart.meter));
    const barDiv = bar.pickup ? Math.round(bar.pickup * quarterPerBeat * DIV) : fullDiv;
    const notes = notesXml(bar.simile ? repeatedMusic(bars, i) : bar, ctx, barDiv, tie);
    tie = notes.tieOut;
    parts.push(notes.xml, right);
    // MusicXML 4.0: a pickup is measure 0 with implicit="yes" (it does not count in measure numbering)
    const attrs = bar.pickup ? ` number="0" implicit="yes"` : ` number="${number++}"`;
    measures.push(`    <measure${attrs}>${parts.join("")}</measure>`);
  });
  const composer = chart.composer ? `<creator type="composer">${esc(chart.composer)}</creator>` : "";
  return [
    `<?xml version="1.0" encoding="UTF-8" standalone="no"?>`,
    `<!DOCTYPE score-partwise PUBLIC "-//Recordare//DTD MusicXML 4.0 Partwise//EN" "http://www.musicxml.org/dtds/partwise.dtd">`,
    `<score-partwise version="4.0">`,
    `  <work><work-title>${esc(chart.title)}</work-title></work>`,
    // The concert key as written, so a reader can tell F# from Gb through a part that only shows the written key
    `  <identification>${composer}<encoding><software>Pedalpoint</software><supports element="transpose" type="yes"/></encoding><miscellaneous><miscellaneous-field name="concert-key">${esc(chart.key)}</miscellaneous-field></miscellaneous></identification>`,
    `  <part-list><score-part id="P1"><part-name>${esc(opts.partName ?? "Lead sheet")}</part-name></score-part></part-list>`,
    `  <part id="P1">`,
    ...measures,
    `  </part>`,
    `</score-partwise>`,
    "",
  ].join("\n");
}

export function exportMusicXml(chart: Chart, opts: ExportOptions = {}): string {
  return exportBars(chart, chartBars(chart), opts);
}
