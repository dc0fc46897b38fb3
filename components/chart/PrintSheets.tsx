"use client";
// The part as printed: laid out for a sheet of paper, black on white, one page per sheet. Laid out
// and drawn in idle time after the screen pages, so it never delays the first chord, and finished on
// `beforeprint`, so printing (or saving as PDF) finds every sheet drawn.
import { useEffect, useRef } from "react";
import type { Arrangement } from "@/lib/chart/model";
import { layoutChart } from "@/lib/render/layout";
import type { DrawJob } from "./draw-sheets";
import type { PageText } from "./engrave";
import { musicFontsReady } from "./music-fonts";
import { worldFontsFor } from "./world-fonts";

/** A4 within 12 mm margins at 96 px to the inch, near enough to US Letter too. */
const SHEET = { width: 700, height: 1000, zoom: 1 };

const idle = (cb: () => void) => (typeof requestIdleCallback === "function" ? requestIdleCallback(cb, { timeout: 5000 }) : setTimeout(cb, 400));

export function PrintSheets({ arrangement, text }: { arrangement: Arrangement; text: PageText }) {
  const host = useRef<HTMLDivElement>(null);
  const textKey = JSON.stringify(text);
  useEffect(() => {
    const el = host.current;
    if (!el) return;
    let job: DrawJob | null = null;
    let gone = false;
    const finish = () => job?.finish();
    idle(() => {
      if (gone) return;
      void Promise.all([import("./draw-sheets"), musicFontsReady(), worldFontsFor(textKey)]).then(([{ drawSheets }]) => {
        if (gone) return;
        const layout = layoutChart(arrangement, SHEET);
        job = drawSheets(el, { layout, writtenKey: arrangement.writtenKey, text: JSON.parse(textKey) as PageText });
      });
    });
    window.addEventListener("beforeprint", finish);
    return () => {
      gone = true;
      window.removeEventListener("beforeprint", finish);
      job?.cancel();
    };
  }, [arrangement, textKey]);
  return <div ref={host} className="pp-print" aria-hidden="true" />;
}
