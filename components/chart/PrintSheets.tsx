"use client";
// The part as printed: laid out for a sheet of paper, black on white, one page per sheet. Drawn
// after the screen pages, while the player reads, so printing (or saving as PDF) is immediate.
import { useEffect, useMemo, useRef } from "react";
import type { Arrangement } from "@/lib/chart/model";
import { layoutChart } from "@/lib/render/layout";
import { drawSheets, musicFontsReady } from "./draw-sheets";
import type { PageText } from "./engrave";

/** A4 within 12 mm margins at 96 px to the inch, near enough to US Letter too. */
const SHEET = { width: 700, height: 1000, zoom: 1 };

export function PrintSheets({ arrangement, text }: { arrangement: Arrangement; text: PageText }) {
  const host = useRef<HTMLDivElement>(null);
  const layout = useMemo(() => layoutChart(arrangement, SHEET), [arrangement]);
  const textKey = JSON.stringify(text);
  useEffect(() => {
    const el = host.current;
    if (!el) return;
    let job: ReturnType<typeof drawSheets> | null = null;
    const t = setTimeout(() => {
      void musicFontsReady().then(() => {
        job = drawSheets(el, { layout, writtenKey: arrangement.writtenKey, text: JSON.parse(textKey) as PageText });
      });
    }, 400);
    return () => {
      clearTimeout(t);
      job?.cancel();
    };
  }, [layout, arrangement.writtenKey, textKey]);
  return <div ref={host} className="pp-print" aria-hidden="true" />;
}
