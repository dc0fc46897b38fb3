"use client";
// One chart as pages fitted to a box: lays out for the box's size, draws the shown page and the next
// into stacked sheets (later pages when idle, see draw-sheets.ts), and turns by swapping which sheet
// is visible (PageFlipper). The engraving code (VexFlow) is loaded only here, on first draw, while the
// page's title and chord names show at once as text in the same box (ChartPreview). The shown page's
// element carries data-testid="chart-page" with data-page / data-pages for outside checks.
import { useEffect, useImperativeHandle, useMemo, useRef, useState, type Ref } from "react";
import type { Arrangement } from "@/lib/chart/model";
import type { BarMark } from "@/lib/setlist/marks";
import { layoutChart } from "@/lib/render/layout";
import type { LayoutOptions } from "@/lib/render/types";
import type { View } from "@/lib/render/early-turn";
import { PageFlipper } from "@/components/bandstand/flipper";
import { ChartPreview } from "./ChartPreview";
import type { DrawJob } from "./draw-sheets";
import type { PageText } from "./engrave";
import { musicFontsReady } from "./music-fonts";
import { worldFontsFor } from "./world-fonts";
import "./sheets.css";

/** The engraving code and its fonts, fetched once. */
let engraving: Promise<[typeof import("./draw-sheets"), void]> | null = null;
function loadEngraving() {
  engraving ??= Promise.all([import("./draw-sheets"), musicFontsReady()]).catch((e: unknown) => {
    // A failed fetch is not kept: the next draw tries again.
    engraving = null;
    throw e;
  });
  return engraving;
}
const prefetch = () => void loadEngraving().catch(() => undefined);
// A page that draws starts fetching the engraving once the browser is idle after its first paint, so
// it arrives while the book is still being read from the device or the network, not after.
if (typeof window !== "undefined") {
  if ("requestIdleCallback" in window) window.requestIdleCallback(prefetch, { timeout: 1500 });
  else setTimeout(prefetch, 200);
}

export interface PagedChartControls {
  next: () => boolean;
  back: () => boolean;
  goToPage: (page: number) => void;
}

export interface PagedChartProps {
  arrangement: Arrangement;
  text: PageText;
  width: number;
  height: number;
  earlyTurn?: boolean;
  /** Page shown first when drawn (read once, on mount): 1-based, or the last page. */
  startPage?: number | "last";
  layout?: Partial<LayoutOptions>;
  /** Accessible name of the page region. */
  label: string;
  controls?: Ref<PagedChartControls>;
  onView?: (view: View, page: number, pages: number, atStart: boolean, atEnd: boolean) => void;
  className?: string;
  /** The reader's personal marks, keyed by `${section}:${bar}` (lib/setlist marksByBar). */
  marks?: ReadonlyMap<string, BarMark>;
  /** This device follows the leader's calls on a gig (shown as data-following for outside checks). */
  following?: boolean;
}

export function PagedChart({
  arrangement,
  text,
  width,
  height,
  earlyTurn = false,
  startPage = 1,
  layout: extra,
  label,
  controls,
  onView,
  className,
  marks,
  following,
}: PagedChartProps) {
  const host = useRef<HTMLDivElement>(null);
  const live = useRef<HTMLParagraphElement>(null);
  const flipper = useRef<PageFlipper | null>(null);
  const [error, setError] = useState<string | null>(null);
  // Until the first engraving is in, the page shows as text (ChartPreview).
  const [engraved, setEngraved] = useState(false);
  const [firstPage] = useState(startPage);
  const onViewRef = useRef(onView);
  const startRef = useRef(startPage);
  const textKey = JSON.stringify(text);
  const marksKey = JSON.stringify(marks ? [...marks] : []);
  useEffect(() => {
    onViewRef.current = onView;
  });
  // `extra` is compared by value so callers can pass a literal.
  const extraKey = JSON.stringify(extra ?? {});
  // Marks take a lane of their own under the staff, so they are laid out with the bars.
  const layout = useMemo(() => {
    if (width <= 0 || height <= 0) return null;
    const marks = new Map(JSON.parse(marksKey) as [string, BarMark][]);
    return layoutChart(arrangement, { width, height, ...(JSON.parse(extraKey) as Partial<LayoutOptions>), marks });
  }, [arrangement, width, height, extraKey, marksKey]);

  useImperativeHandle(controls, () => ({
    next: () => flipper.current?.go(1) ?? false,
    back: () => flipper.current?.go(-1) ?? false,
    goToPage: (p: number) => flipper.current?.goToPage(p),
  }));

  useEffect(() => {
    const el = host.current;
    if (!el || !layout) return;
    let job: DrawJob | null = null;
    let gone = false;
    const pages = layout.pages.length;
    const keepPage = Math.max(1, Math.min(flipper.current ? Number(el.dataset.page ?? 1) : startRef.current === "last" ? Infinity : startRef.current, pages));
    el.dataset.drawn = "false";
    const words = [textKey, ...(JSON.parse(marksKey) as [string, BarMark][]).flatMap(([, m]) => m.texts)].join(" ");
    Promise.all([loadEngraving(), worldFontsFor(words)])
      .then(([[{ drawSheets }]]) => {
        if (gone) return;
        const drawnMarks = new Map(JSON.parse(marksKey) as [string, BarMark][]);
        const sheets = drawSheets(el, { layout, writtenKey: arrangement.writtenKey, text: JSON.parse(textKey) as PageText, marks: drawnMarks, startPage: keepPage });
        job = sheets;
        let placed = false;
        flipper.current = new PageFlipper(
          el,
          pages,
          { earlyTurnFractions: layout.pages.map((p) => p.earlyTurnY / p.height) },
          live.current,
          earlyTurn,
          (view, index, views) => {
            // A page not drawn yet (a jump) is drawn before this frame; the one after it next task.
            if (placed) sheets.show(Number(el.dataset.page));
            onViewRef.current?.(view, Number(el.dataset.page), pages, index === 0, index === views.length - 1);
          },
        );
        flipper.current.goToPage(keepPage);
        placed = true;
        el.dataset.drawn = "true";
        setEngraved(true);
        return sheets.done.then(() => {
          if (!gone) el.dataset.drawnAll = "true";
        });
      })
      .catch((e: unknown) => setError(e instanceof Error ? e.message : String(e)));
    return () => {
      gone = true;
      job?.cancel();
    };
  }, [layout, arrangement.writtenKey, textKey, earlyTurn, marksKey]);

  const previewPage = layout && !engraved ? layout.pages[Math.max(1, Math.min(firstPage === "last" ? Infinity : firstPage, layout.pages.length)) - 1] : undefined;
  return (
    <div className={className} style={{ width, height, position: "relative" }}>
      {previewPage ? <ChartPreview page={previewPage} text={text} /> : null}
      <div
        ref={host}
        className="pp-sheets"
        style={{ width, height }}
        data-testid="chart-page"
        data-following={following ? "true" : undefined}
        data-page="1"
        data-pages={layout?.pages.length ?? 0}
        data-systems={layout?.pages[0]?.systems.length ?? 0}
        role="region"
        aria-label={label}
      />
      <p ref={live} aria-live="polite" className="sr-only" />
      {error ? (
        <p role="alert" className="absolute inset-x-0 top-4 text-center font-semibold">
          This chart could not be drawn: {error}
        </p>
      ) : null}
    </div>
  );
}
