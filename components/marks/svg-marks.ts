// Draws a player's personal mark onto an engraved bar: a highlight behind the bar and/or a short
// text above it. Plain SVG on the bar's group, so it works in every part and key alike (the mark is
// anchored to the bar, not to what is written in it).
import type { BarMark } from "@/lib/setlist";

const SVG_NS = "http://www.w3.org/2000/svg";

export interface MarkGeometry {
  x: number;
  width: number;
  /** Top of the system's slot and of its staff, in page units. */
  systemY: number;
  staffY: number;
}

export function drawBarMark(group: SVGGElement, g: MarkGeometry, mark: BarMark): void {
  group.setAttribute("data-mark", mark.texts.join(" / ") || "highlight");
  group.classList.add("pp-marked");
  if (mark.highlight) {
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
  if (mark.texts.length > 0) {
    const text = document.createElementNS(SVG_NS, "text");
    text.setAttribute("x", String(g.x + g.width - 4));
    text.setAttribute("y", String(Math.max(g.systemY + 12, g.staffY - 30)));
    text.setAttribute("text-anchor", "end");
    text.setAttribute("font-size", "12");
    text.setAttribute("font-style", "italic");
    text.setAttribute("class", "pp-mark-text");
    text.setAttribute("fill", "currentColor");
    text.textContent = mark.texts.join(" / ");
    group.appendChild(text);
  }
}
