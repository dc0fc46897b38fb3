// Walks the measures of one <part>: positions in quarter notes from <divisions>, <backup> and
// <forward>; harmonies, the first voice's notes, barlines, rehearsal marks and tempo.
import type { Harmony } from "./kinds";
import { readHarmony } from "./harmony-read";
import { isStep, type Pitch, type Transposition } from "./pitch";
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
  harmonies: { pos: number; harmony: Harmony }[];
  notes: RawNote[];
  beats: number;
  beatType: number;
  fifths: number;
  minor: boolean;
  transpose: Transposition | null;
  rehearsal?: string;
  words: string[];
  tempo?: number;
  repeatStart: boolean;
  repeatEnd: boolean;
  repeatTimes?: number;
  endingStart?: number;
  endingStop: boolean;
  simileStart: boolean;
  simileStop: boolean;
}

export type Tally = Map<string, number>;

export function bump(t: Tally, what: string, n = 1): void {
  t.set(what, (t.get(what) ?? 0) + n);
}

const IGNORED_MEASURE_CHILDREN = new Set(["print", "figured-bass", "bookmark", "link", "grouping", "listening"]);

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

export function readPart(part: XNode, skipped: Tally): RawMeasure[] {
  let divisions = 1;
  let fifths = 0;
  let minor = false;
  let beats = 4;
  let beatType = 4;
  let transpose: Transposition | null = null;
  let melodyVoice: string | null = null;
  const out: RawMeasure[] = [];

  for (const m of children(part, "measure")) {
    const rm: RawMeasure = {
      number: m.attrs.number ?? String(out.length + 1),
      harmonies: [], notes: [], beats, beatType, fifths, minor, transpose, words: [],
      repeatStart: false, repeatEnd: false, endingStop: false, simileStart: false, simileStop: false,
    };
    let pos = 0;
    const setAttrs = () => Object.assign(rm, { beats, beatType, fifths, minor, transpose });
    for (const el of m.children) {
      switch (el.name) {
        case "attributes": {
          const d = numberOf(el, "divisions");
          if (d && d > 0) divisions = d;
          const key = child(el, "key");
          if (key && numberOf(key, "fifths") !== undefined) {
            fifths = Math.round(numberOf(key, "fifths") ?? 0);
            minor = (textOf(key, "mode") ?? "major").trim() === "minor";
          }
          const time = child(el, "time");
          const b = Number(textOf(time, "beats"));
          const bt = Number(textOf(time, "beat-type"));
          if (time && Number.isFinite(b) && b > 0 && Number.isFinite(bt) && bt > 0) {
            beats = b;
            beatType = bt;
          }
          const tr = child(el, "transpose");
          if (tr) transpose = readTransposeEl(tr);
          for (const mr of children(child(el, "measure-style"), "measure-repeat")) {
            if (mr.attrs.type === "start") rm.simileStart = true;
            if (mr.attrs.type === "stop") rm.simileStop = true;
          }
          if (out.length === 0 || pos === 0) setAttrs();
          break;
        }
        case "harmony": {
          const r = readHarmony(el);
          if (!r) {
            bump(skipped, "chord symbols without a root");
            break;
          }
          if (r.unknownKind) bump(skipped, `chord kinds not in MusicXML 4.0 ("${r.unknownKind}"), read as plain triads`);
          const offset = numberOf(el, "offset") ?? 0;
          rm.harmonies.push({ pos: Math.max(0, (pos + offset) / divisions), harmony: r.harmony });
          break;
        }
        case "note": {
          const dur = numberOf(el, "duration") ?? 0;
          if (child(el, "grace")) {
            bump(skipped, "grace notes");
            break;
          }
          if (child(el, "chord")) {
            bump(skipped, "notes stacked under the melody (chords in the staff)");
            break;
          }
          const voice = textOf(el, "voice") ?? "1";
          melodyVoice ??= voice;
          pos += dur;
          if (voice !== melodyVoice || child(el, "cue")) {
            bump(skipped, "notes in other voices");
            break;
          }
          if (children(el, "lyric").length) bump(skipped, "lyrics", children(el, "lyric").length);
          const notations = child(el, "notations");
          if (notations?.children.some((c) => c.name !== "tied")) bump(skipped, "articulations, slurs and other note marks");
          const pitchEl = child(el, "pitch");
          const isRest = !!child(el, "rest");
          // an invisible rest only carries chord symbols to their beats; it is not melody
          if (isRest && el.attrs["print-object"] === "no") break;
          if (!pitchEl && !isRest) bump(skipped, "unpitched (percussion) notes");
          rm.notes.push({
            pitch: pitchEl ? readPitch(pitchEl) : null,
            quarters: dur / divisions,
            type: textOf(el, "type")?.trim(),
            dots: children(el, "dot").length,
            tie: children(el, "tie").some((t) => t.attrs.type === "start"),
          });
          break;
        }
        case "backup":
          pos = Math.max(0, pos - (numberOf(el, "duration") ?? 0));
          break;
        case "forward":
          pos += numberOf(el, "duration") ?? 0;
          break;
        case "direction": {
          for (const dt of children(el, "direction-type")) {
            for (const d of dt.children) {
              if (d.name === "rehearsal" && d.text) rm.rehearsal ??= d.text;
              else if (d.name === "words" && d.text) rm.words.push(d.text);
              else if (d.name === "metronome") {
                const bpm = numberOf(d, "per-minute");
                // the chart's tempo counts the marked beat, whatever its note value
                if (bpm) rm.tempo ??= Math.round(bpm);
              } else if (d.name === "dynamics") bump(skipped, "dynamics");
              else if (d.name === "wedge") bump(skipped, "hairpins");
              else if (!["rehearsal", "words", "metronome"].includes(d.name)) bump(skipped, `"${d.name}" directions`);
            }
          }
          const snd = child(el, "sound");
          if (snd?.attrs.tempo && Number(snd.attrs.tempo) > 0) rm.tempo ??= Math.round(Number(snd.attrs.tempo));
          break;
        }
        case "sound":
          if (el.attrs.tempo && Number(el.attrs.tempo) > 0) rm.tempo ??= Math.round(Number(el.attrs.tempo));
          break;
        case "barline": {
          const rep = child(el, "repeat");
          if (rep?.attrs.direction === "forward") rm.repeatStart = true;
          if (rep?.attrs.direction === "backward") {
            rm.repeatEnd = true;
            const times = Number(rep.attrs.times);
            if (Number.isInteger(times) && times > 2) rm.repeatTimes = Math.min(16, times);
          }
          const ending = child(el, "ending");
          if (ending) {
            const n = Number((ending.attrs.number ?? "1").split(/[ ,]+/)[0]);
            if (ending.attrs.type === "start") rm.endingStart = Number.isInteger(n) && n >= 1 ? Math.min(8, n) : 1;
            else rm.endingStop = true;
          }
          if (el.attrs.location !== "left" && child(el, "fermata")) bump(skipped, "fermatas");
          const seg = child(el, "segno") ?? child(el, "coda");
          if (seg) bump(skipped, "segno and coda signs");
          break;
        }
        default:
          if (!IGNORED_MEASURE_CHILDREN.has(el.name)) bump(skipped, `"${el.name}" elements`);
      }
    }
    out.push(rm);
  }
  return out;
}
