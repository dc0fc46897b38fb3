// Draws every page of a layout into its own sheet inside `host`: page 1 at once, the rest one per
// task right after, so the first page shows quickly and later turns find their page already drawn.
import type { ChartLayout } from "@/lib/render/types";
import type { BarMark } from "@/lib/setlist/marks";
import { engravePage, type PageText } from "./engrave";

let fonts: Promise<void> | null = null;

/** Resolves when the bundled music and text fonts are usable (they are data URLs: no request). */
export function musicFontsReady(): Promise<void> {
  fonts ??= (async () => {
    if (typeof document === "undefined" || !document.fonts) return;
    await Promise.allSettled([document.fonts.load("30px Bravura"), document.fonts.load("20px Academico")]);
    await document.fonts.ready;
  })();
  return fonts;
}

export interface SheetsInput {
  layout: ChartLayout;
  writtenKey: string;
  text: PageText;
  /** The reader's personal marks (see EngraveInput.marks). */
  marks?: ReadonlyMap<string, BarMark>;
}

export interface DrawJob {
  /** Resolves when every page is drawn (or the job was cancelled). */
  done: Promise<void>;
  cancel: () => void;
}

export function drawSheets(host: HTMLElement, input: SheetsInput, onPage?: (page: number) => void): DrawJob {
  let cancelled = false;
  for (const old of host.querySelectorAll(":scope > [data-sheet]")) old.remove();
  const sheets = input.layout.pages.map((page) => {
    const sheet = document.createElement("div");
    sheet.dataset.sheet = String(page.number);
    host.appendChild(sheet);
    return sheet;
  });
  const drawOne = (i: number) => {
    const page = input.layout.pages[i];
    const sheet = sheets[i];
    if (!page || !sheet) return;
    engravePage(sheet, { layout: input.layout, page, writtenKey: input.writtenKey, text: input.text, marks: input.marks });
    onPage?.(page.number);
  };
  const done = new Promise<void>((resolve) => {
    drawOne(0);
    let i = 1;
    const nextTask = () => {
      if (cancelled || i >= sheets.length) return resolve();
      drawOne(i++);
      setTimeout(nextTask, 0);
    };
    setTimeout(nextTask, 0);
  });
  return {
    done,
    cancel: () => {
      cancelled = true;
    },
  };
}
