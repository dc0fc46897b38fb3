// Splits one bar line of chart text into bars with their barline marks, keeping columns for errors.
import { ChartTextError } from "./text-error";

export interface Word {
  text: string;
  /** 1-based column in the line. */
  column: number;
}

export interface ScannedBar {
  kind: "bar";
  words: Word[];
  column: number;
  repeatStart: boolean;
  repeatEnd: boolean;
  repeatTimes?: number;
  /** `[n` (or `[1,2` for several passes) at the start of this bar: the passes it names. */
  ending: number[] | null;
  /** `]` after this bar closes its ending. */
  endingClose: boolean;
  /** Column of the `[n`, for errors about the ending. */
  endingColumn?: number;
}
export type BarToken = ScannedBar;

interface Open {
  words: Word[];
  column: number;
  repeatStart: boolean;
  ending: number[] | null;
  endingColumn?: number;
  byBarline: boolean;
}

// Sticky patterns read at the cursor without copying the rest of the line (a slice per mark would
// make a line of many marks cost its length squared).
const TIMES_RE = /\s*[x×](\d{1,2})(?![\w#])/y;
const ENDING_RE = /\[(\d(?:,\s?\d)*)\.?/y;

function readAt(re: RegExp, body: string, at: number): RegExpExecArray | null {
  re.lastIndex = at;
  return re.exec(body);
}

export function scanBarLine(body: string, offset: number, line: number): ScannedBar[] {
  const bars: ScannedBar[] = [];
  let cur: Open | null = null;
  const col = (i: number) => offset + i + 1;
  const fail = (i: number, msg: string): never => {
    throw new ChartTextError(line, col(i), msg);
  };
  const close = (extra: Partial<ScannedBar> = {}): ScannedBar | null => {
    if (!cur) return null;
    const hasContent = cur.words.length > 0 || cur.repeatStart || cur.ending !== null;
    if (!hasContent && !extra.repeatEnd && !extra.endingClose) return null;
    const b: ScannedBar = {
      kind: "bar",
      words: cur.words,
      column: cur.column,
      repeatStart: cur.repeatStart,
      repeatEnd: false,
      ending: cur.ending,
      endingClose: false,
      ...(cur.endingColumn !== undefined ? { endingColumn: cur.endingColumn } : {}),
      ...extra,
    };
    bars.push(b);
    cur = null;
    return b;
  };
  const open = (i: number, byBarline: boolean, repeatStart = false) => {
    cur = { words: [], column: col(i), repeatStart, ending: null, byBarline };
  };

  let i = 0;
  while (i < body.length) {
    const ch = body[i]!;
    if (/\s/.test(ch)) {
      i++;
      continue;
    }
    if (ch === ":" && body[i + 1] === "|") {
      const at = i;
      i += 2;
      let times: number | undefined;
      const t = readAt(TIMES_RE, body, i);
      if (t) {
        times = Number(t[1]);
        if (times < 2 || times > 16) fail(at, `A repeat is played 2 to 16 times (":|x3" means three times through)`);
        i += t[0].length;
      }
      const extra: Partial<ScannedBar> = { repeatEnd: true };
      if (times !== undefined && times > 2) extra.repeatTimes = times;
      const c = cur as Open | null;
      if (c && c.words.length > 0) close(extra);
      else {
        const prev = bars[bars.length - 1];
        if (!prev || (c && (c.repeatStart || c.ending !== null))) fail(at, "A :| closes a bar: put it after the bar's chords, like | F7 :|");
        Object.assign(prev!, extra);
        cur = null;
      }
      if (body[i] === ":") {
        // ":|:" ends one repeat and starts the next.
        open(i, true, true);
        i++;
      }
      continue;
    }
    if (ch === "|") {
      const at = i;
      i += body[i + 1] === "|" ? 2 : 1;
      const c = cur as Open | null;
      if (c && c.words.length === 0 && c.byBarline && !c.repeatStart && c.ending === null) {
        fail(at, "This bar is empty: write a chord, % to repeat the bar before, or N.C. for no chord");
      }
      if (c && c.words.length === 0 && (c.repeatStart || c.ending !== null)) fail(at, "This bar is empty: write its chords before the next |");
      close();
      if (body[i] === ":") {
        open(at, true, true);
        i++;
      } else open(at, true);
      continue;
    }
    if (ch === "[") {
      const m = readAt(ENDING_RE, body, i);
      if (!m) fail(i, "An ending is written [1, [2 (or [1,2 for two passes) … at the start of its bar");
      const c = cur as Open | null;
      if (c && c.words.length > 0) fail(i, `An ending (${m![0]}) goes at the start of a bar, right after the |`);
      const passes = m![1]!.split(",").map((d) => Number(d.trim()));
      if (passes.some((n) => n < 1 || n > 8)) fail(i, "Endings are numbered 1 to 8");
      if (passes.some((n, k) => k > 0 && n <= passes[k - 1]!)) fail(i, "An ending for several passes names them in rising order, like [1,2");
      if (!c) open(i, false);
      (cur as Open | null)!.ending = passes;
      (cur as Open | null)!.endingColumn = col(i);
      i += m![0].length;
      continue;
    }
    if (ch === "]") {
      const c = cur as Open | null;
      if (c && c.words.length > 0) close({ endingClose: true });
      else {
        const prev = bars[bars.length - 1];
        if (!prev) fail(i, "A ] closes an ending after its last bar");
        prev!.endingClose = true;
      }
      i++;
      continue;
    }
    let j = i;
    while (j < body.length && !/\s/.test(body[j]!) && body[j] !== "|" && body[j] !== "]" && body[j] !== "[" && !(body[j] === ":" && body[j + 1] === "|")) j++;
    if (!cur) open(i, false);
    (cur as Open | null)!.words.push({ text: body.slice(i, j), column: col(i) });
    i = j;
  }
  const c = cur as Open | null;
  if (c && c.words.length === 0 && (c.repeatStart || c.ending !== null)) {
    fail(body.length - 1, "A bar line ends on an open bar: write its chords after the |: or [n");
  }
  close();
  return bars;
}
