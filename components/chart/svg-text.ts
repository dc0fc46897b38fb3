// Text, boxes and brackets drawn straight into VexFlow's SVG. Chord symbols are one <text> with a
// raised <tspan> for extensions, so the browser places the parts and nothing needs measuring.
import type { RenderContext } from "./vexflow";
import { ENDING_LABEL_SIZE, SUPERSCRIPT_SCALE, labelBoxWidth, splitSymbol } from "@/lib/render/metrics";
import { displayParts } from "@/lib/render/metrics";
import { WORLD_FAMILIES } from "./world-fonts";

const NS = "http://www.w3.org/2000/svg";
// Academico has Latin only. Greek, Cyrillic, extended Latin, Japanese and emoji come from the Noto
// faces we serve (world-fonts.ts, the same on every device); other scripts fall through to the
// device's own fonts, then to any serif, so no character is dropped.
export const TEXT_FONT = `Academico, ${WORLD_FAMILIES.map((f) => `"${f}"`).join(", ")}, Georgia, "Noto Sans CJK KR", "PingFang SC", "Microsoft YaHei", "Noto Sans Arabic", "Noto Sans Devanagari", serif`;

interface TextStyle {
  size: number;
  anchor?: "start" | "middle" | "end";
  bold?: boolean;
  italic?: boolean;
  cls?: string;
}

function parentOf(ctx: RenderContext): Element {
  const c = ctx as unknown as { parent?: Element; svg?: Element };
  return c.parent ?? (c.svg as Element);
}

function el<K extends keyof SVGElementTagNameMap>(name: K, attrs: Record<string, string | number>): SVGElementTagNameMap[K] {
  const e = document.createElementNS(NS, name);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, String(v));
  return e;
}

export function addText(ctx: RenderContext, text: string, x: number, y: number, style: TextStyle): SVGTextElement {
  const t = el("text", {
    x,
    y,
    "font-family": TEXT_FONT,
    "font-size": style.size,
    fill: "currentColor",
    // VexFlow puts stroke="black" on the root; text must not inherit an outline.
    stroke: "none",
    "text-anchor": style.anchor ?? "start",
    ...(style.bold ? { "font-weight": "bold" } : {}),
    ...(style.italic ? { "font-style": "italic" } : {}),
    ...(style.cls ? { class: style.cls } : {}),
  });
  t.textContent = text;
  parentOf(ctx).appendChild(t);
  return t;
}

export function drawChordSymbol(ctx: RenderContext, symbol: string, x: number, y: number, size: number) {
  const p = symbol === "N.C." ? { ...splitSymbol(symbol), root: "N.C." } : displayParts(symbol);
  const t = addText(ctx, p.root + p.accidental + p.quality, x, y, { size, bold: true, cls: "pp-chord" });
  t.setAttribute("data-symbol", symbol);
  if (p.superscript) {
    const sup = el("tspan", { "font-size": Math.round(size * SUPERSCRIPT_SCALE), dy: -Math.round(size * 0.38) });
    sup.textContent = p.superscript;
    t.appendChild(sup);
  }
  if (p.bass) {
    const bass = el("tspan", { dy: p.superscript ? Math.round(size * 0.38) : 0 });
    bass.textContent = "/" + p.bass;
    t.appendChild(bass);
  }
}

/** A boxed rehearsal label; returns the box width. */
export function drawLabelBox(ctx: RenderContext, label: string, x: number, top: number, size: number, intro: boolean): number {
  const w = labelBoxWidth(label, size);
  const h = size + 8;
  parentOf(ctx).appendChild(
    el("rect", { x, y: top, width: w, height: h, rx: 2, fill: "none", stroke: "currentColor", "stroke-width": intro ? 1.5 : 2, class: "pp-label-box" }),
  );
  addText(ctx, label, x + w / 2, top + h - 6, { size, anchor: "middle", bold: true, cls: intro ? "pp-label pp-intro-label" : "pp-label" });
  return w;
}

export function drawEndingBracket(
  ctx: RenderContext,
  b: { x1: number; x2: number; y: number; label: string | null; open: boolean; close: boolean },
) {
  const hook = 14;
  const d = [
    b.open ? `M${b.x1} ${b.y + hook} L${b.x1} ${b.y}` : `M${b.x1} ${b.y}`,
    `L${b.x2} ${b.y}`,
    b.close ? `L${b.x2} ${b.y + hook}` : "",
  ].join(" ");
  parentOf(ctx).appendChild(el("path", { d, fill: "none", stroke: "currentColor", "stroke-width": 1.5, class: "pp-ending" }));
  if (b.label) addText(ctx, b.label, b.x1 + 5, b.y + 14, { size: ENDING_LABEL_SIZE, bold: true, cls: "pp-ending-number" });
}
