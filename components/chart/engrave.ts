// Draws one laid-out page into an SVG with VexFlow. Positions come from lib/render; this file only
// turns them into staves, slashes, barlines and text. VexFlow is the core build (./vexflow); its fonts
// are files loaded before the first draw (music-fonts.ts) and precached by the service worker.
import {
  Barline,
  Beam,
  Accidental,
  Formatter,
  GlyphNote,
  RepeatNote,
  Renderer,
  Stave,
  StaveNote,
  Voice,
  type Note,
  type RenderContext,
} from "./vexflow";
import type { ChartLayout, Page, PlacedBar, System } from "@/lib/render/types";
import { endingLabel } from "@/lib/chart/endings";
import { melodyNotes, melodyTies } from "./melody";
import { textWidth } from "@/lib/render/metrics";
import { addText, drawChordSymbol, drawEndingBracket, drawLabelBox } from "./svg-text";
import { drawBarMark } from "@/components/marks/svg-marks";
import { barKey, type BarMark } from "@/lib/setlist/marks";

export interface PageText {
  title: string;
  composer: string;
  /** "medium swing · ♩ = 160 · Key of F" */
  details: string;
  partLabel: string;
}

export interface EngraveInput {
  layout: ChartLayout;
  page: Page;
  writtenKey: string;
  text: PageText;
  /** Draw the beat slashes with VexFlow's formatter (true) or leave them out (benchmarks). */
  slashes?: boolean;
  /** The reader's personal marks, keyed by `${section}:${bar}` of the bar's place in the chart. */
  marks?: ReadonlyMap<string, BarMark>;
}

const LABEL_FONT = 15;
/** SMuFL noteheadSlashHorizontalEnds: a beat slash with no stem. */
const SLASH = "\uE101";

function vexKey(key: string): string {
  const k = key.replace("♭", "b").replace("♯", "#");
  return /^[A-G][b#]?m?$/.test(k) ? k : "C";
}

function endBarline(b: PlacedBar): number {
  if (b.bar.repeatEnd) return Barline.type.REPEAT_END;
  if (b.bar.barline === "final") return Barline.type.END;
  if (b.bar.barline === "double") return Barline.type.DOUBLE;
  return Barline.type.SINGLE;
}

function beatNotes(beats: number, unit: number): Note[] {
  const duration = unit === 2 ? "h" : unit === 8 ? "8" : "q";
  return Array.from({ length: beats }, () => new GlyphNote(SLASH, { duration }, { line: 2 }));
}

function drawBar(ctx: RenderContext, layout: ChartLayout, b: PlacedBar, system: System, key: string, slashes: boolean): Note[] {
  const stave = new Stave(b.x, system.staffY, b.width, { spaceAboveStaffLn: 0, spaceBelowStaffLn: 0 });
  if (b.showClef) stave.addClef(layout.clef);
  if (b.showKey) stave.addKeySignature(key);
  if (b.showTime) stave.addTimeSignature(`${layout.meter.beats}/${layout.meter.unit}`);
  if (b.bar.repeatStart) stave.setBegBarType(Barline.type.REPEAT_BEGIN);
  stave.setEndBarType(endBarline(b));
  stave.setContext(ctx).draw();
  const under = system.staffY + 58;
  let direction = b.bar.direction ?? "";
  if (b.bar.repeatTimes && b.bar.repeatEnd) direction = direction ? `${direction} · ×${b.bar.repeatTimes}` : `×${b.bar.repeatTimes}`;
  if (direction) {
    // Under the staff: at the repeat sign it belongs to, else where the bar's beats start.
    const atEnd = b.bar.repeatEnd;
    addText(ctx, direction, atEnd ? b.x + b.width - 4 : b.noteX, under, { size: 14, anchor: atEnd ? "end" : "start", italic: true, cls: "pp-direction" });
  }

  let notes: Note[];
  const melody = b.bar.melody?.length && !b.bar.simile ? melodyNotes(b.bar.melody, layout.clef) : null;
  if (b.bar.simile) notes = [new RepeatNote("1", { duration: "w", alignCenter: true })];
  else if (melody) notes = melody;
  else if (slashes) notes = beatNotes(layout.meter.beats, layout.meter.unit);
  else notes = [];
  if (notes.length) {
    const voice = new Voice({ numBeats: layout.meter.beats, beatValue: layout.meter.unit }).setMode(Voice.Mode.SOFT);
    voice.addTickables(notes);
    if (melody) Accidental.applyAccidentals([voice], key);
    const beams = melody ? Beam.generateBeams(melody.filter((n): n is StaveNote => n instanceof StaveNote)) : [];
    new Formatter().joinVoices([voice]).formatToStave([voice], stave);
    voice.draw(ctx, stave);
    beams.forEach((beam) => beam.setContext(ctx).draw());
    if (melody && b.bar.melody) melodyTies(b.bar.melody, melody).forEach((tie) => tie.setContext(ctx).draw());
  }
  return notes;
}

function drawSymbols(ctx: RenderContext, layout: ChartLayout, b: PlacedBar, system: System, notes: Note[], nextX: number) {
  const y = system.staffY - 12;
  b.chords.forEach((box, i) => {
    // Sit over the beat's slash when there is room; never past the next symbol's box.
    const beatNote = notes.length === layout.meter.beats ? notes[Math.floor(box.beat)] : undefined;
    const want = beatNote ? beatNote.getAbsoluteX() - 2 : box.x;
    const limit = (b.chords[i + 1]?.x ?? nextX) - box.width - 6;
    const x = Math.max(box.x, Math.min(want, limit));
    drawChordSymbol(ctx, box.symbol, x, y, box.size);
  });
}

function drawLabels(ctx: RenderContext, b: PlacedBar, system: System) {
  const top = system.y + 2;
  if (b.label) drawLabelBox(ctx, b.label, b.x, system.labelY, LABEL_FONT, b.intro);
  if (b.endingStart || b.endingEnd || b.bar.ending !== null) {
    drawEndingBracket(ctx, {
      x1: b.endingStart ? b.endingX : b.x,
      x2: b.x + b.width - (b.endingEnd ? 6 : 0),
      y: top + 4,
      label: b.endingStart && b.bar.ending !== null ? endingLabel(b.bar) : null,
      open: b.endingStart,
      close: b.endingEnd && b.bar.ending === 1,
    });
  }
}

/** A title that fits `room`: smaller down to `min`, then cut with an ellipsis (the page names it whole). */
export function fitTitle(title: string, size: number, room: number, min = 16): { text: string; size: number } {
  const wide = textWidth(title, size);
  if (wide <= room) return { text: title, size };
  const fitted = Math.max(min, Math.floor((size * room) / wide));
  if (textWidth(title, fitted) <= room) return { text: title, size: fitted };
  const chars = [...title];
  while (chars.length > 1 && textWidth(chars.join("") + "…", fitted) > room) chars.pop();
  return { text: chars.join("").trimEnd() + "…", size: fitted };
}

function drawHeader(ctx: RenderContext, page: Page, text: PageText) {
  if (!page.header) return;
  const y = page.header.y;
  if (page.header.compact) {
    // A desk read: title left, details and composer on one line under it, all smaller.
    const t = fitTitle(text.title, 22, page.width - 32);
    addText(ctx, t.text, 16, y + 20, { size: t.size, bold: true, cls: "pp-title" }).setAttribute("data-title", text.title);
    if (text.details) addText(ctx, text.details, 16, y + 38, { size: 13, bold: true, cls: "pp-details" });
    // The composer goes where it fits; on a very narrow page it is left to the chart's details below.
    const besideTitle = textWidth(t.text, t.size) + textWidth(text.composer, 13) + 48 <= page.width;
    const besideDetails = textWidth(text.details, 13) + textWidth(text.composer, 13) + 48 <= page.width;
    if (text.composer && (besideTitle || besideDetails)) {
      addText(ctx, text.composer, page.width - 16, besideTitle ? y + 20 : y + 38, { size: 13, anchor: "end", italic: true, cls: "pp-composer" });
    }
    return;
  }
  const t = fitTitle(text.title, 28, page.width - 32);
  addText(ctx, t.text, page.width / 2, y + 30, { size: t.size, anchor: "middle", bold: true, cls: "pp-title" }).setAttribute("data-title", text.title);
  // Details left and composer right share a line when both fit; on a narrow page the composer goes
  // up under the title.
  const fits = textWidth(text.details, 15) + textWidth(text.composer, 15) + 48 <= page.width;
  if (text.composer) {
    addText(ctx, text.composer, page.width - 16, fits ? y + 62 : y + 48, { size: fits ? 15 : 13, anchor: "end", italic: true, cls: "pp-composer" });
  }
  if (text.details) addText(ctx, text.details, 16, fits ? y + 62 : y + 66, { size: 15, bold: true, cls: "pp-details" });
}

/** Draws `input.page` into `host` (emptied first) and returns the SVG element. */
export function engravePage(host: HTMLElement, input: EngraveInput): SVGSVGElement {
  const { layout, page, text } = input;
  host.replaceChildren();
  const renderer = new Renderer(host as HTMLDivElement, Renderer.Backends.SVG);
  renderer.resize(Math.round(page.width * page.zoom), Math.round(page.height * page.zoom));
  const ctx = renderer.getContext();
  ctx.scale(page.zoom, page.zoom);
  ctx.setFillStyle("currentColor");
  ctx.setStrokeStyle("currentColor");
  const svg = host.querySelector("svg") as SVGSVGElement;
  svg.setAttribute("viewBox", `0 0 ${page.width} ${page.height}`);
  // Every mark takes the theme's colour (stage, ember, black for print).
  svg.setAttribute("fill", "currentColor");
  svg.setAttribute("stroke", "currentColor");
  svg.removeAttribute("width");
  svg.removeAttribute("height");
  svg.setAttribute("role", "img");
  svg.setAttribute("aria-label", `${text.title}, ${text.partLabel}, page ${page.number}`);

  addText(ctx, text.partLabel, page.width - 12, 18, { size: 16, anchor: "end", bold: true, cls: "pp-part" });
  if (page.number > 1) {
    // The running title gives way to the part label in the corner.
    const room = page.width - 24 - textWidth(text.partLabel, 16) - 12 - textWidth(` · ${page.number}`, 14);
    const t = fitTitle(text.title, 14, room, 12);
    addText(ctx, `${t.text} · ${page.number}`, 12, 18, { size: t.size, cls: "pp-running" });
  }
  drawHeader(ctx, page, text);

  const key = vexKey(input.writtenKey);
  for (const system of page.systems) {
    system.bars.forEach((b, i) => {
      const group = ctx.openGroup() as SVGGElement | undefined;
      // Our own class names (VexFlow would prefix them), for print styles and outside checks.
      group?.setAttribute("class", b.intro ? "pp-bar pp-intro" : "pp-bar");
      group?.setAttribute("data-bar", String(b.bar.index));
      group?.setAttribute("data-part", b.bar.part);
      if (b.bar.source) group?.setAttribute("data-source", barKey(b.bar.source));
      const notes = drawBar(ctx, layout, b, system, key, input.slashes ?? true);
      const next = system.bars[i + 1];
      drawSymbols(ctx, layout, b, system, notes, next ? next.noteX : b.x + b.width + 4);
      drawLabels(ctx, b, system);
      const mark = b.bar.source ? input.marks?.get(barKey(b.bar.source)) : undefined;
      if (mark && group) drawBarMark(group, { x: b.x, width: b.width, staffY: system.staffY, laneY: system.markLaneY, words: b.markWords }, mark);
      ctx.closeGroup();
    });
  }
  return svg;
}
