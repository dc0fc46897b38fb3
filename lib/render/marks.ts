// A player's mark words, laid out in a lane of their own under the staff of the bar they sit on:
// wrapped at word breaks to the bar's width, so they never crowd the chord symbols, the ending
// bracket or the next bar's words. Only systems that hold a mark get the lane.
import { textWidth } from "./metrics";

export const MARK_FONT_SIZE = 12;
export const MARK_LINE_HEIGHT = 14;
/** The lane starts this far under the staff's top line: past the clef's tail and a bar's direction line. */
export const MARK_LANE_DROP = 64;
/** Space kept under the lane's last line. */
export const MARK_LANE_PAD = 6;

/** Splits one word wider than the line at characters, so even a long word stays inside its bar. */
function breakWord(word: string, width: number, size: number): string[] {
  const pieces: string[] = [];
  let piece = "";
  for (const ch of word) {
    if (piece && textWidth(piece + ch, size) > width) {
      pieces.push(piece);
      piece = "";
    }
    piece += ch;
  }
  return piece ? [...pieces, piece] : pieces;
}

/** The mark's words as lines no wider than `width` (page units) at the mark font size. */
export function wrapMarkWords(text: string, width: number, size = MARK_FONT_SIZE): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const joined = line ? `${line} ${word}` : word;
    if (textWidth(joined, size) <= width) {
      line = joined;
      continue;
    }
    if (line) lines.push(line);
    const pieces = breakWord(word, width, size);
    line = pieces.pop() ?? "";
    lines.push(...pieces);
  }
  return line ? [...lines, line] : lines;
}

/** Height of a mark lane holding `lines` lines (0 for none). */
export function markLaneHeight(lines: number): number {
  return lines > 0 ? lines * MARK_LINE_HEIGHT + MARK_LANE_PAD : 0;
}
