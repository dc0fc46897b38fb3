// Draws the pages of a layout into their own sheets inside `host`, lazily: the page on screen and the
// one after it at once, every later page in idle time, and a page the reader jumps to (or turns to
// before idle time reached it) on demand. A turn to a drawn page stays a swap (PageFlipper); after
// each turn the page after the new one is drawn in the next task, so the following turn is one too.
import type { ChartLayout } from "@/lib/render/types";
import type { BarMark } from "@/lib/setlist/marks";
import { engravePage, type PageText } from "./engrave";

export { musicFontsReady } from "./music-fonts";

export interface SheetsInput {
  layout: ChartLayout;
  writtenKey: string;
  text: PageText;
  /** The reader's personal marks (see EngraveInput.marks). */
  marks?: ReadonlyMap<string, BarMark>;
  /** Page to draw first (1-based); default 1. */
  startPage?: number;
}

export interface DrawJob {
  /** Resolves when every page is drawn (or the job was cancelled). */
  done: Promise<void>;
  /** Draws `page` now if it is not drawn yet, and queues the page after it for the next task. */
  show: (page: number) => void;
  /** Draws every page not drawn yet, now (before printing). */
  finish: () => void;
  cancel: () => void;
}

type Idle = (cb: () => void) => void;
const whenIdle: Idle =
  typeof window !== "undefined" && "requestIdleCallback" in window
    ? (cb) => window.requestIdleCallback(cb, { timeout: 3000 })
    : (cb) => setTimeout(cb, 50);

export function drawSheets(host: HTMLElement, input: SheetsInput, onPage?: (page: number) => void): DrawJob {
  let cancelled = false;
  for (const old of host.querySelectorAll(":scope > [data-sheet]")) old.remove();
  const pages = input.layout.pages;
  const sheets = pages.map((page) => {
    const sheet = document.createElement("div");
    sheet.dataset.sheet = String(page.number);
    host.appendChild(sheet);
    return sheet;
  });
  const drawn = new Set<number>();
  let resolveDone: () => void = () => {};
  const done = new Promise<void>((r) => (resolveDone = r));

  const draw = (n: number) => {
    const page = pages[n - 1];
    const sheet = sheets[n - 1];
    if (cancelled || !page || !sheet || drawn.has(n)) return;
    engravePage(sheet, { layout: input.layout, page, writtenKey: input.writtenKey, text: input.text, marks: input.marks });
    drawn.add(n);
    onPage?.(n);
    if (drawn.size === pages.length) resolveDone();
  };
  // Later pages one per idle period, so a long chart never holds the main thread for long.
  const idleNext = () => {
    if (cancelled) return resolveDone();
    const n = pages.findIndex((p) => !drawn.has(p.number)) + 1;
    if (n === 0) return resolveDone();
    draw(n);
    whenIdle(idleNext);
  };

  const start = Math.max(1, Math.min(input.startPage ?? 1, pages.length));
  draw(start);
  draw(start + 1);
  if (drawn.size === pages.length || pages.length === 0) resolveDone();
  else whenIdle(idleNext);

  return {
    done,
    show(n) {
      draw(n);
      if (n + 1 <= pages.length && !drawn.has(n + 1)) setTimeout(() => draw(n + 1), 0);
    },
    finish() {
      for (const p of pages) draw(p.number);
    },
    cancel() {
      cancelled = true;
      resolveDone();
    },
  };
}
