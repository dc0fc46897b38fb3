"use client";
// One chart as pages fitted to a box: lays out for the box's size, draws every page ahead into
// stacked sheets, and turns by swapping which sheet is visible (PageFlipper). The shown page's
// element carries data-testid="chart-page" with data-page / data-pages for outside checks.
import { useEffect, useImperativeHandle, useMemo, useRef, useState, type Ref } from "react";
import type { Arrangement } from "@/lib/chart/model";
import type { BarMark } from "@/lib/setlist/marks";
import { layoutChart } from "@/lib/render/layout";
import type { LayoutOptions } from "@/lib/render/types";
import type { View } from "@/lib/render/early-turn";
import { PageFlipper } from "@/components/bandstand/flipper";
import { drawSheets, musicFontsReady } from "./draw-sheets";
import type { PageText } from "./engrave";
import "./sheets.css";

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
}: PagedChartProps) {
  const host = useRef<HTMLDivElement>(null);
  const live = useRef<HTMLParagraphElement>(null);
  const flipper = useRef<PageFlipper | null>(null);
  const [error, setError] = useState<string | null>(null);
  const onViewRef = useRef(onView);
  const startRef = useRef(startPage);
  const textKey = JSON.stringify(text);
  const marksKey = JSON.stringify(marks ? [...marks] : []);
  useEffect(() => {
    onViewRef.current = onView;
  });
  // `extra` is compared by value so callers can pass a literal.
  const extraKey = JSON.stringify(extra ?? {});
  const layout = useMemo(
    () => (width > 0 && height > 0 ? layoutChart(arrangement, { width, height, ...(JSON.parse(extraKey) as Partial<LayoutOptions>) }) : null),
    [arrangement, width, height, extraKey],
  );

  useImperativeHandle(controls, () => ({
    next: () => flipper.current?.go(1) ?? false,
    back: () => flipper.current?.go(-1) ?? false,
    goToPage: (p: number) => flipper.current?.goToPage(p),
  }));

  useEffect(() => {
    const el = host.current;
    if (!el || !layout) return;
    let job: ReturnType<typeof drawSheets> | null = null;
    let gone = false;
    const keepPage = flipper.current ? Number(el.dataset.page ?? 1) : startRef.current === "last" ? Infinity : startRef.current;
    el.dataset.drawn = "false";
    musicFontsReady()
      .then(() => {
        if (gone) return;
        const drawnMarks = new Map(JSON.parse(marksKey) as [string, BarMark][]);
        job = drawSheets(el, { layout, writtenKey: arrangement.writtenKey, text: JSON.parse(textKey) as PageText, marks: drawnMarks });
        const pages = layout.pages.length;
        flipper.current = new PageFlipper(
          el,
          pages,
          { earlyTurnFractions: layout.pages.map((p) => p.earlyTurnY / p.height) },
          live.current,
          earlyTurn,
          (view, index, views) => onViewRef.current?.(view, Number(el.dataset.page), pages, index === 0, index === views.length - 1),
        );
        flipper.current.goToPage(Math.max(1, Math.min(keepPage, pages)));
        el.dataset.drawn = "true";
        return job.done.then(() => {
          if (!gone) el.dataset.drawnAll = "true";
        });
      })
      .catch((e: unknown) => setError(e instanceof Error ? e.message : String(e)));
    return () => {
      gone = true;
      job?.cancel();
    };
  }, [layout, arrangement.writtenKey, textKey, earlyTurn, marksKey]);

  return (
    <div className={className} style={{ width, height, position: "relative" }}>
      <div
        ref={host}
        className="pp-sheets"
        style={{ width, height }}
        data-testid="chart-page"
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
