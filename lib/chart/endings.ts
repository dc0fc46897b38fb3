// Numbered endings: which passes through a repeat play an ending bar, and how its bracket is labelled.
// An ending may serve several passes (`[1,2` in chart text, MusicXML `<ending number="1, 2">`). Pure.

/** The repeat and ending marks of a bar, as both the chart model and a performance bar carry them. */
export interface RepeatMarks {
  repeatStart: boolean;
  repeatEnd: boolean;
  repeatTimes?: number;
  ending: number | null;
  endingPasses?: number[];
}

type EndingMarks = Pick<RepeatMarks, "ending" | "endingPasses">;

/** Every pass an ending bar is played on, ascending; null for a bar outside any ending. */
export function endingPassesOf(bar: EndingMarks): number[] | null {
  if (bar.ending === null) return null;
  return bar.endingPasses ?? [bar.ending];
}

/** Is this bar played on `pass` through its repeat? Bars outside an ending always are. */
export function playsOnPass(bar: EndingMarks, pass: number): boolean {
  if (bar.ending === null) return true;
  return bar.endingPasses ? bar.endingPasses.includes(pass) : bar.ending === pass;
}

/** The last pass an ending bar is played on (its highest number). */
export function lastEndingPass(bar: EndingMarks): number | null {
  const passes = endingPassesOf(bar);
  return passes ? passes[passes.length - 1]! : null;
}

/** Do two bars belong to the same numbered ending (same passes)? */
export function sameEnding(a: EndingMarks | undefined, b: EndingMarks | undefined): boolean {
  const pa = a ? endingPassesOf(a) : null;
  const pb = b ? endingPassesOf(b) : null;
  if (pa === null || pb === null) return pa === pb;
  return pa.length === pb.length && pa.every((n, i) => n === pb[i]);
}

/** The passes as written in chart text and in MusicXML's `number` attribute: "1", "1, 2". */
export function endingNumberText(bar: EndingMarks): string {
  return (endingPassesOf(bar) ?? []).join(", ");
}

/** The bracket's printed label: "1.", "1, 2." (common practice: the pass numbers, each ending with a full stop). */
export function endingLabel(bar: EndingMarks): string {
  return `${endingNumberText(bar)}.`;
}

/**
 * The passes an ending names, from text like "1", "1, 2" or "1,2": ascending, no repeats, each 1–8;
 * null when the text names none.
 */
export function parseEndingPasses(text: string): number[] | null {
  const numbers = text
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(Number);
  if (numbers.length === 0 || numbers.some((n) => !Number.isInteger(n) || n < 1 || n > 8)) return null;
  return [...new Set(numbers)].sort((a, b) => a - b);
}

/** The model's fields for an ending on `passes`: `ending` is the first pass, `endingPasses` only when several. */
export function endingFields(passes: number[] | null): EndingMarks {
  if (!passes || passes.length === 0) return { ending: null };
  return passes.length > 1 ? { ending: passes[0]!, endingPasses: passes } : { ending: passes[0]! };
}
