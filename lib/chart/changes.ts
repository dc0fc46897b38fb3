// What changed between two revisions of a chart, in a few plain lines for the player who reads it:
// metadata, bars whose chords changed (spelled in the player's written key), sections added or
// removed, and tonight's intro/ending when a set list's choices changed. Pure: no I/O, no React.
import { parseChord, transposeChord, transposeChordToKey, writtenKey } from "@/lib/music";
import type { Bar, Chart, Section } from "./model";

export interface ChangeLine {
  kind: "meta" | "bar" | "section" | "intro" | "ending";
  text: string;
}

/** Tonight's choices for the tune on a set list, as words (the set-list module words them). */
export interface TonightWords {
  key?: string | null;
  intro?: string;
  ending?: string;
}

export interface ChangeOptions {
  /** The player's instrument id (concert, bb, eb, f, concert-bass). */
  instrument?: string;
  /** Tonight's concert key for the tune (a singer's key); default the chart's key. */
  tonightKey?: string | null;
  /** Tonight's set-list choices before and after, when the set list changed too. */
  tonight?: { before: TonightWords; after: TonightWords };
  /** Cap on bar lines; the rest are counted ("and 3 more bars"). */
  maxBars?: number;
}

/** ♭ and ♯ as printed: "Bb7(b9)" → "B♭7(♭9)". */
export function prettySymbol(s: string): string {
  return s.replace(/([A-G])b/g, "$1♭").replace(/b(\d)/g, "♭$1").replace(/#/g, "♯");
}

function chordsOf(bar: Bar): string {
  if (bar.simile) return "%";
  if (bar.chords.length === 0) return "–";
  return bar.chords.map((c) => c.symbol).join(" ");
}

/** A concert symbol as this player reads it tonight. */
function reader(chart: Chart, opts: ChangeOptions): (symbol: string) => string {
  const concertKey = opts.tonightKey || chart.key;
  const instrument = opts.instrument ?? "concert";
  return (symbol) => {
    try {
      parseChord(symbol);
    } catch {
      return symbol; // N.C. and the like read the same in every key
    }
    const moved = concertKey === chart.key ? symbol : transposeChordToKey(symbol, chart.key, concertKey);
    return prettySymbol(transposeChord(moved, concertKey, instrument));
  };
}

function readBar(bar: Bar, read: (s: string) => string): string {
  return chordsOf(bar)
    .split(" ")
    .map((t) => (t === "%" || t === "–" ? t : read(t)))
    .join(" ");
}

function metaLines(a: Chart, b: Chart, opts: ChangeOptions): ChangeLine[] {
  const out: ChangeLine[] = [];
  if (a.title !== b.title) out.push({ kind: "meta", text: `title: ${a.title} → ${b.title}` });
  if (a.key !== b.key) {
    const key = (k: string) => prettySymbol(writtenKey(k, opts.instrument ?? "concert"));
    out.push({ kind: "meta", text: `key: ${key(a.key)} → ${key(b.key)}` });
  }
  if (a.tempo !== b.tempo) out.push({ kind: "meta", text: `tempo: ${a.tempo ?? "none"} → ${b.tempo ?? "none"}` });
  if (a.feel !== b.feel) out.push({ kind: "meta", text: `feel: ${a.feel || "none"} → ${b.feel || "none"}` });
  const meter = (c: Chart) => `${c.meter.beats}/${c.meter.unit}`;
  if (meter(a) !== meter(b)) out.push({ kind: "meta", text: `time: ${meter(a)} → ${meter(b)}` });
  return out;
}

/** The old revision with its chords moved into the new key, so a key change alone marks no bars. */
function inNewKey(a: Chart, b: Chart): Chart {
  if (a.key === b.key) return a;
  const move = (s: Section): Section => ({
    ...s,
    bars: s.bars.map((bar) => ({
      ...bar,
      chords: bar.chords.map((c) => {
        try {
          return { ...c, symbol: transposeChordToKey(c.symbol, a.key, b.key) };
        } catch {
          return c;
        }
      }),
    })),
  });
  return { ...a, key: b.key, sections: a.sections.map(move), intro: a.intro ? move(a.intro) : null };
}

function sectionLines(a: Chart, b: Chart): ChangeLine[] {
  const count = (c: Chart) => c.sections.reduce((m, s) => m.set(s.label, (m.get(s.label) ?? 0) + 1), new Map<string, number>());
  const ca = count(a);
  const cb = count(b);
  const out: ChangeLine[] = [];
  for (const [label, n] of cb) if (n > (ca.get(label) ?? 0)) out.push({ kind: "section", text: `section ${label} added` });
  for (const [label, n] of ca) if (n > (cb.get(label) ?? 0)) out.push({ kind: "section", text: `section ${label} removed` });
  return out;
}

/** Bars whose chords differ, numbered through the form as the player counts them (bar 1 = first bar of the form). */
function barLines(a: Chart, b: Chart, read: (s: string) => string, max: number): ChangeLine[] {
  const out: ChangeLine[] = [];
  let changed = 0;
  let number = 0;
  const used = new Set<number>();
  for (const sb of b.sections) {
    // The old section with the same label (first one not matched yet).
    const ai = a.sections.findIndex((s, i) => !used.has(i) && s.label === sb.label);
    if (ai >= 0) used.add(ai);
    const sa = ai >= 0 ? a.sections[ai] : undefined;
    sb.bars.forEach((bar, i) => {
      number++;
      if (!sa) return; // a new section is one line, not a line per bar
      const before = sa.bars[i];
      if (before && chordsOf(before) === chordsOf(bar)) return;
      changed++;
      if (changed <= max) out.push({ kind: "bar", text: before ? `bar ${number}: ${readBar(before, read)} → ${readBar(bar, read)}` : `bar ${number} added: ${readBar(bar, read)}` });
    });
    if (sa && sa.bars.length > sb.bars.length) {
      const gone = sa.bars.length - sb.bars.length;
      changed++;
      if (changed <= max) out.push({ kind: "bar", text: `section ${sb.label}: ${gone} bar${gone === 1 ? "" : "s"} taken out` });
    }
  }
  if (changed > max) out.push({ kind: "bar", text: `and ${changed - max} more bar${changed - max === 1 ? "" : "s"}` });
  return out;
}

function introLines(a: Chart, b: Chart, read: (s: string) => string): ChangeLine[] {
  const words = (s: Section | null) => (s ? s.bars.map((bar) => readBar(bar, read)).join(" | ") : "none");
  if (words(a.intro) === words(b.intro)) return [];
  if (!a.intro) return [{ kind: "intro", text: `composed intro added (${b.intro!.bars.length} bars)` }];
  if (!b.intro) return [{ kind: "intro", text: "composed intro taken out" }];
  return [{ kind: "intro", text: `composed intro: ${words(a.intro)} → ${words(b.intro)}` }];
}

function tonightLines(t: ChangeOptions["tonight"]): ChangeLine[] {
  if (!t) return [];
  const out: ChangeLine[] = [];
  if ((t.before.key ?? null) !== (t.after.key ?? null) && t.after.key) out.push({ kind: "meta", text: `tonight's key: ${prettySymbol(t.before.key ?? "as written")} → ${prettySymbol(t.after.key)}` });
  if (t.before.intro !== t.after.intro) out.push({ kind: "intro", text: `tonight's intro: ${t.before.intro ?? "none"} → ${t.after.intro ?? "none"}` });
  if (t.before.ending !== t.after.ending) out.push({ kind: "ending", text: `tonight's ending: ${t.before.ending ?? "as written"} → ${t.after.ending ?? "as written"}` });
  return out;
}

/** The lines that tell a player what changed from `before` to `after`. Empty when nothing they read changed. */
export function describeChanges(before: Chart, after: Chart, opts: ChangeOptions = {}): ChangeLine[] {
  const read = reader(after, opts);
  const moved = inNewKey(before, after);
  return [...metaLines(before, after, opts), ...tonightLines(opts.tonight), ...sectionLines(before, after), ...introLines(moved, after, read), ...barLines(moved, after, read, opts.maxBars ?? 6)];
}

/** One line for a notification: "Tidewater Waltz now in A♭" when the key moved, else its first change. */
export function headline(title: string, lines: readonly ChangeLine[]): string {
  const key = lines.find((l) => l.text.startsWith("tonight's key:") || l.text.startsWith("key:"));
  if (key) return `${title} now in ${key.text.split("→ ")[1] ?? ""}`.trim();
  const first = lines[0];
  return first ? `${title}: ${first.text}` : `${title} updated`;
}
