// Draws a player's personal mark onto an engraved bar: a highlight behind the bar's staff and/or its
// words, in the lane under the staff that the layout kept for them (lib/render/marks.ts), one line
// per wrapped line. Plain SVG on the bar's group, so it works in every part and key alike (the mark is
// anchored to the bar, not to what is written in it).
import type { BarMark } from "@/lib/setlist";
import type { MarkWords } from "@/lib/render/types";
import { MARK_FONT_SIZE, MARK_LINE_HEIGHT } from "@/lib/render/marks";
import { TEXT_FONT } from "@/components/chart/svg-text";

const SVG_NS = "http://www.w3.org/2000/svg";

export interface MarkGeometry {
  x: number;
  width: number;
  /** Top of the system's staff, and of its mark lane (null when the system has none), in page units. */
  staffY: number;
  laneY: number | null;
  words: MarkWords | null;
}

function drawHighlight(group: SVGGElement, g: MarkGeometry): void {
  const rect = document.createElementNS(SVG_NS, "rect");
  rect.setAttribute("x", String(g.x + 1));
  rect.setAttribute("y", String(g.staffY - 4));
  rect.setAttribute("width", String(Math.max(0, g.width - 2)));
  rect.setAttribute("height", "48");
  rect.setAttribute("class", "pp-mark-highlight");
  rect.setAttribute("fill", "#f2c14e");
  rect.setAttribute("fill-opacity", "0.35");
  rect.setAttribute("pointer-events", "none");
  group.insertBefore(rect, group.firstChild);
}

function drawWords(group: SVGGElement, words: MarkWords, laneY: number): void {
  const text = document.createElementNS(SVG_NS, "text");
  text.setAttribute("font-size", String(MARK_FONT_SIZE));
  text.setAttribute("font-family", TEXT_FONT);
  text.setAttribute("font-style", "italic");
  text.setAttribute("class", "pp-mark-text");
  text.setAttribute("fill", "currentColor");
  text.setAttribute("stroke", "none");
  words.lines.forEach((line, i) => {
    const span = document.createElementNS(SVG_NS, "tspan");
    span.setAttribute("x", String(words.x));
    span.setAttribute("y", String(laneY + MARK_FONT_SIZE + i * MARK_LINE_HEIGHT));
    span.setAttribute("class", "pp-mark-line");
    span.textContent = line;
    text.appendChild(span);
  });
  group.appendChild(text);
}

export function drawBarMark(group: SVGGElement, g: MarkGeometry, mark: BarMark): void {
  group.setAttribute("data-mark", mark.texts.join(" / ") || "highlight");
  group.classList.add("pp-marked");
  if (mark.highlight) drawHighlight(group, g);
  if (g.words && g.laneY !== null) drawWords(group, g.words, g.laneY);
}
