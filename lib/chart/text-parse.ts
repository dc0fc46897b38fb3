// Chart text → chart model. The format is described in docs/chart-text.md.
// Two passes: metadata first (so `time:` may come anywhere), then sections, bars and melody lines.
import { ChordSymbolError, formatChord, parseChord } from "@/lib/music";
import { ChartSchema, type Bar, type Chart, type Meter, type Section } from "./model";
import { scanBarLine, type BarToken } from "./text-scan";
import { barQuarters, beatWords, noteQuarters, readMelodyNote } from "./melody";
import { ChartTextError } from "./text-error";
import { endingFields } from "./endings";
import { METADATA_FIELDS, readField, type Field, type Meta } from "./text-fields";

export { ChartTextError, METADATA_FIELDS };

// A real chart is a few hundred lines at most. Longer texts are refused before any parsing so one
// paste or one sync push cannot buy seconds of CPU (the form's and the routes' zod limits agree).
export const MAX_CHART_TEXT_CHARS = 50_000;
export const MAX_CHART_TEXT_LINES = 5_000;

/** Throws when the text is longer than a chart can be; costs at most one pass, stopping early. */
export function assertChartTextSize(text: string): void {
  if (text.length > MAX_CHART_TEXT_CHARS) {
    throw new ChartTextError(1, 1, `The chart text is too long (${MAX_CHART_TEXT_CHARS.toLocaleString("en")} characters at most)`);
  }
  let lines = 1;
  for (let at = text.indexOf("\n"); at >= 0; at = text.indexOf("\n", at + 1)) {
    if (++lines > MAX_CHART_TEXT_LINES) {
      throw new ChartTextError(MAX_CHART_TEXT_LINES + 1, 1, `The chart text has too many lines (${MAX_CHART_TEXT_LINES.toLocaleString("en")} at most)`);
    }
  }
}

// `Name:` starts a line; a colon right before `|` is a repeat end (`C7:|`) unless it is `Name:|:`.
const HEADER_RE = /^(\s*)([A-Za-z][\w '’&.()\-]{0,60}?)\s*:(?!\|(?!:))(.*)$/;

/** Where a comment starts: `#` at the start of a line or after a space, followed by a space or the end. */
function stripComment(line: string): string {
  if (/^\s*#/.test(line)) return "";
  const m = /\s#(?=\s|$)/.exec(line);
  return m ? line.slice(0, m.index) : line;
}

interface PendingBar {
  bar: Bar;
  line: number;
  column: number;
  endingStart: number[] | null;
  endingColumn: number;
  endingClose: boolean;
}

interface PendingSection {
  label: string;
  line: number;
  column: number;
  isIntro: boolean;
  bars: PendingBar[];
  /** Bars of the latest bar line, for a `melody:` line under it. */
  lastLine: { bars: PendingBar[]; hasMelody: boolean } | null;
}

// A chart repeats a handful of chords many times; reading each spelling once keeps a long text
// cheap (chord reading is the costliest step per word). Bounded, so it cannot grow without end.
const chordCache = new Map<string, string | ChordSymbolError>();
function readChordSymbol(text: string): string {
  let hit = chordCache.get(text);
  if (hit === undefined) {
    try {
      hit = formatChord(parseChord(text));
    } catch (e) {
      if (!(e instanceof ChordSymbolError)) throw e;
      hit = e;
    }
    if (chordCache.size >= 2_000) chordCache.clear();
    chordCache.set(text, hit);
  }
  if (hit instanceof ChordSymbolError) throw hit;
  return hit;
}

/** `Pickup:` alone (or with bars after it) stays a section name, as it always read; `pickup: 1 beat` is the field. */
function isField(name: string, rest: string): boolean {
  if (!(METADATA_FIELDS as readonly string[]).includes(name)) return false;
  return name !== "pickup" || (rest.trim() !== "" && !/^\s*[|[]/.test(rest));
}

function buildBar(tok: Extract<BarToken, { kind: "bar" }>, meter: Meter, line: number): Bar {
  const words = tok.words;
  const bar: Bar = { chords: [], simile: false, repeatStart: tok.repeatStart, repeatEnd: tok.repeatEnd, ending: null };
  if (tok.repeatTimes !== undefined) bar.repeatTimes = tok.repeatTimes;
  if (words.length === 0) {
    throw new ChartTextError(line, tok.column, "This bar is empty: write a chord, % to repeat the bar before, or N.C. for no chord");
  }
  if (words.some((w) => w.text === "%")) {
    if (words.length > 1) throw new ChartTextError(line, words[0]!.column, "% stands alone in its bar: it repeats the whole bar before");
    bar.simile = true;
    return bar;
  }
  if (words[0]!.text === "/") {
    throw new ChartTextError(line, words[0]!.column, "A bar can't start with /: write the chord first (a / holds the chord before it one more beat)");
  }
  const n = words.length;
  const meterText = `${meter.beats}/${meter.unit}`;
  if (n > meter.beats) {
    throw new ChartTextError(line, words[meter.beats]!.column, `Too many chords for one bar: ${n} chords and slashes, but a ${meterText} bar has ${beatWords(meter.beats)}`);
  }
  // Even shares; when the count does not divide the bar, the earlier chords take the extra beats
  // (| C G7 | in 3/4 is two beats and one, as players read it).
  const base = Math.floor(meter.beats / n);
  const extra = meter.beats - base * n;
  let beat = 0;
  words.forEach((w, i) => {
    const each = base + (i < extra ? 1 : 0);
    if (w.text === "/") {
      bar.chords[bar.chords.length - 1]!.beats += each;
      beat += each;
      return;
    }
    let symbol: string;
    try {
      symbol = readChordSymbol(w.text);
    } catch (e) {
      if (e instanceof ChordSymbolError) throw new ChartTextError(line, w.column, e.message);
      throw e;
    }
    bar.chords.push({ symbol, beat, beats: each });
    beat += each;
  });
  return bar;
}

/** Ending runs: a `[n` lasts until a `:|`, a `]`, the next `[n` or `|:`, or the end of the section. */
function settleEndings(sec: PendingSection): void {
  let active: number[] | null = null;
  const runs: { passes: number[]; last: PendingBar }[] = [];
  // Which pass numbers occur, so each check is one look-up (a long section stays linear).
  const numbers = new Set<number>();
  for (const p of sec.bars) {
    if (p.bar.repeatStart) active = null;
    if (p.endingStart !== null) {
      const first = p.endingStart[0]!;
      if (first > 1 && !numbers.has(first - 1)) {
        throw new ChartTextError(p.line, p.endingColumn, `Ending [${first} comes without an ending [${first - 1} before it in this section`);
      }
      active = p.endingStart;
      for (const n of active) numbers.add(n);
      runs.push({ passes: active, last: p });
    }
    Object.assign(p.bar, endingFields(active));
    if (active !== null) runs[runs.length - 1]!.last = p;
    if (p.bar.repeatEnd || p.endingClose) active = null;
  }
  for (const r of runs) {
    const label = r.passes.join(",");
    if (numbers.has(r.passes[r.passes.length - 1]! + 1) && !r.last.bar.repeatEnd) {
      throw new ChartTextError(r.last.line, r.last.column, `Ending [${label} must end with :| so the band goes back for the next time through`);
    }
  }
}

function readMelodyLine(text: string, offset: number, line: number, sec: PendingSection | null, meter: Meter): void {
  if (!sec || !sec.lastLine) throw new ChartTextError(line, offset + 1, "A melody line goes right under the bar line it belongs to");
  if (sec.lastLine.hasMelody) throw new ChartTextError(line, offset + 1, "This bar line already has a melody line");
  sec.lastLine.hasMelody = true;
  const segments: { text: string; column: number }[] = [];
  let start = 0;
  const body = text.replace(/^\s*\|/, (m) => " ".repeat(m.length));
  for (let i = 0; i <= body.length; i++) {
    if (i === body.length || body[i] === "|") {
      segments.push({ text: body.slice(start, i), column: offset + start + 1 });
      start = i + 1;
    }
  }
  if (segments.length > 1 && segments[segments.length - 1]!.text.trim() === "") segments.pop();
  const targets = sec.lastLine.bars;
  if (segments.length > targets.length) {
    throw new ChartTextError(line, segments[targets.length]!.column, `This melody line has ${segments.length} bars but the bar line above has ${targets.length}`);
  }
  segments.forEach((seg, i) => {
    const pickup = targets[i]!.bar.pickup;
    const need = barQuarters(pickup ? { beats: pickup, unit: meter.unit } : meter);
    if (seg.text.trim() === "") return;
    const notes = [];
    let total = 0;
    for (const m of seg.text.matchAll(/\S+/g)) {
      const note = readMelodyNote(m[0]);
      if (!note) {
        throw new ChartTextError(line, seg.column + m.index, `"${m[0]}" is not a melody note: write pitch and length like Eb5:q, G4:h. or r:8 for a rest`);
      }
      notes.push(note);
      total += noteQuarters(note);
    }
    if (Math.abs(total - need) > 1e-9) {
      throw new ChartTextError(line, seg.column, `The melody in this bar lasts ${beatWords(total)} (in quarter notes) but the bar holds ${beatWords(need)}: fill it with rests like r:q`);
    }
    targets[i]!.bar.melody = notes;
  });
}

export interface ParseChartOptions {
  /** Header lines the caller supplies in front of the text (the form's fields); not counted against the size limits. */
  header?: readonly string[];
}

export function parseChartText(text: string, options: ParseChartOptions = {}): Chart {
  assertChartTextSize(text);
  const header = options.header ?? [];
  const full = header.length ? `${header.join("\n")}\n${text}` : text;
  const lines = full.replace(/\r\n?/g, "\n").split("\n").map(stripComment);
  const meta: Meta = {};
  const seen = new Map<Field, number>();
  lines.forEach((raw, i) => {
    const m = HEADER_RE.exec(raw);
    if (!m) return;
    const name = m[2]!.trim().toLowerCase() as Field;
    if (!isField(name, m[3]!)) return;
    if (seen.has(name)) throw new ChartTextError(i + 1, m[1]!.length + 1, `${name} is given twice (first on line ${seen.get(name)})`);
    seen.set(name, i + 1);
    readField(name, m[3]!.trim(), i + 1, m[1]!.length + 1, meta);
  });
  const meter = meta.meter ?? { beats: 4, unit: 4 };
  // The pickup is the first bar played: the Intro's when the chart has one, else the form's.
  const introFirst = lines.some((l) => HEADER_RE.exec(l)?.[2]?.trim().toLowerCase() === "intro");
  let pickupLeft = meta.pickup;
  if (pickupLeft !== undefined && pickupLeft >= meter.beats) {
    const line = seen.get("pickup") ?? 1;
    throw new ChartTextError(line, 1, `A pickup is shorter than a bar: a ${meter.beats}/${meter.unit} bar has ${beatWords(meter.beats)}, so the pickup can have at most ${beatWords(meter.beats - 1)}`);
  }

  const sections: PendingSection[] = [];
  let current: PendingSection | null = null;
  const openSection = (label: string, line: number, column: number): PendingSection => {
    const isIntro = label.toLowerCase() === "intro";
    if (isIntro && sections.some((s) => s.isIntro)) throw new ChartTextError(line, column, "The chart already has an Intro section");
    if (label.length > 40) throw new ChartTextError(line, column, "A section name is 40 characters at most");
    const sec: PendingSection = { label: isIntro ? "Intro" : label, line, column, isIntro, bars: [], lastLine: null };
    sections.push(sec);
    return sec;
  };
  const readBars = (body: string, offset: number, line: number) => {
    current ??= openSection("A", line, offset + 1);
    const lineBars: PendingBar[] = [];
    for (const tok of scanBarLine(body, offset, line)) {
      if (tok.kind !== "bar") continue;
      const pickup = pickupLeft !== undefined && current.bars.length === 0 && current.isIntro === introFirst ? pickupLeft : undefined;
      const bar = buildBar(tok, pickup ? { beats: pickup, unit: meter.unit } : meter, line);
      if (pickup) {
        bar.pickup = pickup;
        pickupLeft = undefined;
      }
      const p: PendingBar = { bar, line, column: tok.column, endingStart: tok.ending, endingColumn: tok.endingColumn ?? tok.column, endingClose: tok.endingClose };
      if (bar.simile && current.bars.length === 0) throw new ChartTextError(line, tok.column, "% repeats the bar before, but this section has no bar before it");
      current.bars.push(p);
      lineBars.push(p);
    }
    current.lastLine = { bars: lineBars, hasMelody: false };
  };

  lines.forEach((raw, i) => {
    const line = i + 1;
    if (raw.trim() === "") return;
    const m = HEADER_RE.exec(raw);
    if (m) {
      const name = m[2]!.trim();
      const lower = name.toLowerCase();
      const column = m[1]!.length + 1;
      const rest = m[3]!;
      const restOffset = raw.length - rest.length;
      if (isField(lower, rest)) return;
      if (lower === "melody") return readMelodyLine(rest, restOffset, line, current, meter);
      if (rest.trim() !== "" && !/^\s*[|[]/.test(rest)) {
        throw new ChartTextError(line, column, `"${name}" is not a field we know (the fields are ${METADATA_FIELDS.join(", ")}); a section name stands alone on its line, like "B:"`);
      }
      current = openSection(name, line, column);
      if (rest.trim() !== "") readBars(rest, restOffset, line);
      return;
    }
    readBars(raw, 0, line);
  });

  if (meta.title === undefined) throw new ChartTextError(1, 1, "The chart needs a title: add a line like `title: Night Bus`");
  if (meta.key === undefined) throw new ChartTextError(1, 1, "The chart needs a concert key: add a line like `key: Eb` (or `key: Cm` for minor)");
  for (const s of sections) {
    if (s.bars.length === 0) throw new ChartTextError(s.line, s.column, `Section "${s.label}" has no bars`);
    settleEndings(s);
  }
  const toSection = (s: PendingSection): Section => ({ label: s.label, bars: s.bars.map((p) => p.bar) });
  const intro = sections.find((s) => s.isIntro);
  const form = sections.filter((s) => !s.isIntro);
  const lastLine = lines.reduce((last, l, i) => (l.trim() ? i + 1 : last), 1);
  if (form.length === 0) throw new ChartTextError(lastLine, 1, "The chart has no bars yet: add a section like `A:` followed by a bar line like `| Cmaj7 | Dm7 G7 |`");

  const chart = {
    title: meta.title,
    composer: meta.composer ?? "",
    key: meta.key,
    meter,
    tempo: meta.tempo ?? null,
    feel: meta.feel ?? "",
    intro: intro ? toSection(intro) : null,
    sections: form.map(toSection),
  };
  const checked = ChartSchema.safeParse(chart);
  if (!checked.success) {
    const issue = checked.error.issues[0]!;
    const where = issue.path[0] === "sections" && typeof issue.path[1] === "number" ? form[issue.path[1]] : undefined;
    throw new ChartTextError(where?.line ?? 1, where?.column ?? 1, `The chart is too big for one chart (${issue.message}): at most 64 sections of 512 bars and 16 chords a bar`);
  }
  return checked.data;
}
