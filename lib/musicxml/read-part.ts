// Walks the measures of one <part>: positions in quarter notes from <divisions>, <backup> and
// <forward>; harmonies, the first voice's notes, barlines, rehearsal marks and tempo.
import { parseEndingPasses } from "@/lib/chart/endings";
import type { Harmony } from "./kinds";
import { readHarmony } from "./harmony-read";
import { isStep, type Pitch, type Transposition } from "./pitch";
import type { Skipped } from "./report";
import { child, children, numberOf, textOf, type XNode } from "./xml";

export interface RawNote {
  pitch: Pitch | null;
  quarters: number;
  type?: string;
  dots: number;
  tie: boolean;
}

export interface RawMeasure {
  number: string;
  /** `guessed`: no <offset> and several chords before one note, so they share that note evenly. */
  harmonies: { pos: number; harmony: Harmony; guessed?: boolean; notes?: string[] }[];
  notes: RawNote[];
  beats: number;
  beatType: number;
  fifths: number;
  minor: boolean;
  transpose: Transposition | null;
  rehearsal?: string;
  words: string[];
  /** Every metronome mark, in quarter notes per minute, with how it was written. */
  tempos: { quarters: number; unitQuarters: number; perMinute: number }[];
  tempo?: number;
  /** MusicXML implicit="yes": a pickup or a split measure, not counted in the numbering. */
  implicit: boolean;
  /** How far the first voice reaches, in quarter notes. */
  length: number;
  /** Right-hand barline styles no repeat or final bar explains. */
  barStyles: string[];
  repeatStart: boolean;
  repeatEnd: boolean;
  repeatTimes?: number;
  /** The passes an ending starting here is played on ("1, 2" → [1, 2]), each 1–8. */
  endingStart?: number[];
  endingStop: boolean;
  simileStart: boolean;
  simileStop: boolean;
}

// Layout and linking only: nothing a player reads.
const IGNORED_MEASURE_CHILDREN = new Set(["print", "bookmark", "link", "grouping", "listening"]);
const BEAT_UNIT_QUARTERS: Record<string, number> = { breve: 8, whole: 4, half: 2, quarter: 1, eighth: 0.5, "16th": 0.25, "32nd": 0.125, long: 16 };

/**
 * The passes an `<ending number="…">` names (MusicXML 4.0 ending-number: "1", "1, 2", "1,3"); a chart
 * ending is for passes 1–8, so a higher pass or an unreadable number is reported, not guessed silently.
 */
function readEndingNumber(text: string, bar: string, skipped: Skipped): number[] {
  const named = text.split(/[\s,]+/).filter(Boolean).map(Number);
  const passes = parseEndingPasses(named.filter((n) => Number.isInteger(n) && n >= 1 && n <= 8).join(",")) ?? [];
  if (passes.length < named.length) skipped.add(`ending numbers beyond 8 or unreadable ("${text}"), read as ${passes.length ? passes.join(", ") : "ending 1"}`, bar);
  return passes.length ? passes : [1];
}

function readTransposeEl(el: XNode | undefined): Transposition | null {
  if (!el) return null;
  return {
    diatonic: Math.round(numberOf(el, "diatonic") ?? 0),
    chromatic: Math.round(numberOf(el, "chromatic") ?? 0),
    octaveChange: Math.round(numberOf(el, "octave-change") ?? 0),
  };
}

function readPitch(p: XNode): Pitch | null {
  const step = textOf(p, "step")?.trim();
  const octave = numberOf(p, "octave");
  if (!step || !isStep(step) || octave === undefined) return null;
  return { step, alter: Math.round(numberOf(p, "alter") ?? 0), octave: Math.round(octave) };
}

interface Walk {
  rm: RawMeasure;
  pos: number;
  divisions: number;
  melodyVoice: string | null;
  /** Harmonies since the last note with no <offset>: several before one note share it. */
  pending: RawMeasure["harmonies"];
  skipped: Skipped;
}

function readDirection(el: XNode, w: Walk): void {
  const { rm, skipped } = w;
  for (const dt of children(el, "direction-type")) {
    for (const d of dt.children) {
      if (d.name === "rehearsal" && d.text) rm.rehearsal ??= d.text;
      else if (d.name === "words" && d.text) rm.words.push(d.text);
      else if (d.name === "metronome") {
        const units = children(d, "beat-unit");
        const perMinute = numberOf(d, "per-minute");
        const base = BEAT_UNIT_QUARTERS[units[0]?.text ?? ""];
        // MusicXML 4.0: the <beat-unit-dot/> elements right after a beat unit dot it
        let dotCount = 0;
        for (let k = d.children.indexOf(units[0] as XNode) + 1; d.children[k]?.name === "beat-unit-dot"; k++) dotCount++;
        if (base === undefined || !perMinute || perMinute <= 0) {
          skipped.add("tempo marks that equate two note values or give no number", rm.number);
          continue;
        }
        const unitQuarters = base * (2 - 1 / 2 ** Math.min(2, dotCount));
        rm.tempos.push({ quarters: perMinute * unitQuarters, unitQuarters, perMinute });
      } else if (d.name === "dynamics") skipped.add("dynamics", rm.number);
      else if (d.name === "wedge") skipped.add("hairpins", rm.number);
      else skipped.add(`"${d.name}" directions`, rm.number);
    }
  }
  const snd = child(el, "sound");
  if (snd?.attrs.tempo && Number(snd.attrs.tempo) > 0) rm.tempo ??= Number(snd.attrs.tempo);
}

function readBarline(el: XNode, w: Walk, last: boolean): void {
  const { rm, skipped } = w;
  const rep = child(el, "repeat");
  if (rep?.attrs.direction === "forward") rm.repeatStart = true;
  if (rep?.attrs.direction === "backward") {
    rm.repeatEnd = true;
    const times = Number(rep.attrs.times);
    if (Number.isInteger(times) && times > 2) rm.repeatTimes = Math.min(16, times);
    if (Number.isInteger(times) && times > 16) skipped.add("repeats played more than 16 times, read as 16", rm.number);
  }
  const ending = child(el, "ending");
  if (ending) {
    if (ending.attrs.type === "start") rm.endingStart = readEndingNumber(ending.attrs.number ?? "1", rm.number, skipped);
    else rm.endingStop = true;
  }
  const style = textOf(el, "bar-style")?.trim();
  const explained = !style || style === "regular" || (rep && /heavy/.test(style)) || (last && style === "light-heavy");
  if (!explained && el.attrs.location !== "left") rm.barStyles.push(style);
  else if (!explained) skipped.add(`barline styles ("${style}")`, rm.number);
  if (child(el, "fermata")) skipped.add("fermatas", rm.number);
  if (child(el, "segno") ?? child(el, "coda")) skipped.add("segno and coda signs", rm.number);
}

function readNote(el: XNode, w: Walk): void {
  const { rm, skipped } = w;
  const dur = numberOf(el, "duration") ?? 0;
  const lyrics = children(el, "lyric").length;
  if (lyrics) skipped.add("lyrics", rm.number, lyrics);
  if (child(el, "grace")) return skipped.add("grace notes", rm.number);
  if (child(el, "chord")) return skipped.add("notes stacked under the melody (chords in the staff)", rm.number);
  const voice = textOf(el, "voice") ?? "1";
  w.melodyVoice ??= voice;
  if (w.pending.length > 1) {
    // MusicXML 4.0: harmonies in a row before one note change during it; share the note evenly
    w.pending.forEach((h, i) => {
      h.pos += ((dur / w.divisions) * i) / w.pending.length;
      h.guessed = true;
    });
  }
  w.pending = [];
  w.pos += dur;
  if (voice !== w.melodyVoice || child(el, "cue")) return skipped.add("notes in other voices", rm.number);
  rm.length = Math.max(rm.length, w.pos / w.divisions);
  const notations = child(el, "notations");
  if (notations?.children.some((c) => c.name !== "tied")) skipped.add("articulations, slurs and other note marks", rm.number);
  const pitchEl = child(el, "pitch");
  const isRest = !!child(el, "rest");
  // an invisible rest only carries chord symbols to their beats; it is not melody
  if (isRest && el.attrs["print-object"] === "no") return;
  if (!pitchEl && !isRest) skipped.add("unpitched (percussion) notes", rm.number);
  if (child(el, "time-modification")) skipped.add("tuplets", rm.number);
  rm.notes.push({
    pitch: pitchEl ? readPitch(pitchEl) : null,
    quarters: dur / w.divisions,
    type: textOf(el, "type")?.trim(),
    dots: children(el, "dot").length,
    tie: children(el, "tie").some((t) => t.attrs.type === "start"),
  });
}

interface State {
  divisions: number;
  fifths: number;
  minor: boolean;
  beats: number;
  beatType: number;
  transpose: Transposition | null;
}

function readAttributes(el: XNode, st: State, w: Walk, first: boolean): void {
  const d = numberOf(el, "divisions");
  if (d && d > 0) st.divisions = w.divisions = d;
  const key = child(el, "key");
  if (key && numberOf(key, "fifths") !== undefined) {
    st.fifths = Math.round(numberOf(key, "fifths") ?? 0);
    st.minor = (textOf(key, "mode") ?? "major").trim() === "minor";
  }
  const time = child(el, "time");
  const b = Number(textOf(time, "beats"));
  const bt = Number(textOf(time, "beat-type"));
  if (time && Number.isFinite(b) && b > 0 && Number.isFinite(bt) && bt > 0) {
    st.beats = b;
    st.beatType = bt;
  }
  const tr = child(el, "transpose");
  if (tr) st.transpose = readTransposeEl(tr);
  for (const mr of children(child(el, "measure-style"), "measure-repeat")) {
    if (mr.attrs.type === "start") w.rm.simileStart = true;
    if (mr.attrs.type === "stop") w.rm.simileStop = true;
  }
  if (first || w.pos === 0) Object.assign(w.rm, { beats: st.beats, beatType: st.beatType, fifths: st.fifths, minor: st.minor, transpose: st.transpose });
}

export function readPart(part: XNode, skipped: Skipped): RawMeasure[] {
  const st: State = { divisions: 1, fifths: 0, minor: false, beats: 4, beatType: 4, transpose: null };
  let melodyVoice: string | null = null;
  const out: RawMeasure[] = [];
  const measures = children(part, "measure");
  measures.forEach((m, mi) => {
    const rm: RawMeasure = {
      number: m.attrs.number ?? String(out.length + 1),
      harmonies: [], notes: [], beats: st.beats, beatType: st.beatType, fifths: st.fifths, minor: st.minor, transpose: st.transpose,
      words: [], tempos: [], implicit: m.attrs.implicit === "yes", length: 0, barStyles: [],
      repeatStart: false, repeatEnd: false, endingStop: false, simileStart: false, simileStop: false,
    };
    const w: Walk = { rm, pos: 0, divisions: st.divisions, melodyVoice, pending: [], skipped };
    for (const el of m.children) {
      switch (el.name) {
        case "attributes":
          readAttributes(el, st, w, out.length === 0);
          break;
        case "harmony": {
          const r = readHarmony(el);
          if (!r) {
            skipped.add("chord symbols without a root", rm.number);
            break;
          }
          if (r.unknownKind) skipped.add(`chord kinds not in MusicXML 4.0 ("${r.unknownKind}"), read as plain triads`, rm.number);
          const offset = numberOf(el, "offset");
          const h = { pos: Math.max(0, (w.pos + (offset ?? 0)) / w.divisions), harmony: r.harmony, ...(r.notes.length ? { notes: r.notes } : {}) };
          rm.harmonies.push(h);
          if (offset === undefined) w.pending.push(h);
          break;
        }
        case "note":
          readNote(el, w);
          break;
        case "backup":
          w.pos = Math.max(0, w.pos - (numberOf(el, "duration") ?? 0));
          w.pending = [];
          break;
        case "forward":
          w.pos += numberOf(el, "duration") ?? 0;
          w.pending = [];
          break;
        case "direction":
          readDirection(el, w);
          break;
        case "sound":
          if (el.attrs.tempo && Number(el.attrs.tempo) > 0) rm.tempo ??= Number(el.attrs.tempo);
          break;
        case "barline":
          readBarline(el, w, mi === measures.length - 1);
          break;
        case "figured-bass":
          skipped.add("figured bass", rm.number);
          break;
        default:
          if (!IGNORED_MEASURE_CHILDREN.has(el.name)) skipped.add(`"${el.name}" elements`, rm.number);
      }
    }
    melodyVoice = w.melodyVoice;
    out.push(rm);
  });
  return out;
}
