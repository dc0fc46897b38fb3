"use client";
// The chart page: one chart in the reader's part, with the chosen intro and key, page by page.
// A client shell: the chart comes from the local book (useChart), ids from the address bar.
import Link from "next/link";
import { useEffect, useMemo, useRef, useState } from "react";
import type { IntroResult } from "@/lib/chart/model";
import { ChangeSummary } from "@/components/changes/ChangeSummary";
import { markChartSeen, useChart, useMembership } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { ChartHistory } from "@/components/library/ChartHistory";
import { ChartMeta } from "@/components/library/ChartMeta";
import { Button, buttonClass } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { suggestIntros } from "@/lib/chart";
import { PagedChart, type PagedChartControls } from "./PagedChart";
import { InstrumentPicker, IntroPicker, KeyPicker, partReader } from "./Pickers";
import { PrintSheets } from "./PrintSheets";
import { MarksPanel } from "@/components/marks/MarksPanel";
import { NotSharedWithSub } from "@/components/library/SubNotices";
import { useChartMarks } from "@/components/marks/useBarMarks";
import { buildPerformance } from "./performance";
import { useBoxSize } from "./useBoxSize";
import { PlayerPanel } from "@/components/player";
import { useChoices } from "./useChoices";
import { can } from "@/lib/band/roles";

export function ChartScreen() {
  const { bandId, chartId } = useBandRoute();
  const local = useChart(bandId, chartId);
  const membership = useMembership(bandId);
  const choices = useChoices(bandId, membership?.instrument);
  const [box, setBox] = useState<HTMLDivElement | null>(null);
  const size = useBoxSize(box, { bottom: 60 });
  const controls = useRef<PagedChartControls>(null);
  const [counter, setCounter] = useState({ page: 1, pages: 1, atStart: true, atEnd: true });

  useEffect(() => {
    if (chartId && local) void markChartSeen(chartId);
  }, [chartId, local]);

  const chart = local?.body;
  const marks = useChartMarks(chartId, chart);
  const performance = useMemo(() => {
    if (!chart) return null;
    try {
      // A set list's tempo for tonight replaces the chart's own in the title block.
      const played = choices.tempo ? { ...chart, tempo: choices.tempo } : chart;
      return { ok: true as const, ...buildPerformance({ chart: played, instrument: choices.instrument, key: choices.key, intro: choices.intro, tag: choices.tag }) };
    } catch (e) {
      return { ok: false as const, message: e instanceof Error ? e.message : String(e) };
    }
  }, [chart, choices.instrument, choices.key, choices.tempo, choices.intro, choices.tag]);
  const concertKey = choices.key ?? chart?.key ?? "";
  const intros = useMemo<IntroResult[]>(() => {
    if (!chart) return [];
    try {
      // The advice names chords as this player reads them (their part, tonight's key).
      return suggestIntros(chart, partReader({ chartKey: chart.key, concertKey, instrument: choices.instrument }));
    } catch {
      return [];
    }
  }, [chart, concertKey, choices.instrument]);

  if (!bandId || !chartId) return null;
  if (local === undefined) return <p className="p-6 text-ink-muted">Opening the chart…</p>;
  if (local === null || !chart) {
    if (membership && !can(membership.role, "readBook")) return <NotSharedWithSub bandId={bandId} />;
    return (
      <main id="main" className="mx-auto max-w-3xl p-6">
        <Notice kind="error" title="This chart is not in your book">
          It may have been removed, or it has not reached this device yet. <Link href={`/bands/${encodeURIComponent(bandId)}`}>Back to the library</Link>
        </Notice>
      </main>
    );
  }

  const base = `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}`;
  return (
    <main id="main" className="mx-auto w-full max-w-7xl px-3 py-2 sm:px-6">
      <div className="no-print mb-2 flex flex-wrap items-center justify-between gap-x-3 gap-y-2">
        <div className="flex min-w-0 items-baseline gap-3">
          <Link href={`/bands/${encodeURIComponent(bandId)}`} className="text-sm text-ink-muted underline-offset-4 hover:underline">
            ← Library
          </Link>
          <h1 className="truncate text-xl font-bold tracking-tight">{chart.title}</h1>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link href={`${base}/bandstand${choices.query}`} className={buttonClass("primary")} data-testid="open-bandstand">
            Bandstand view
          </Link>
          <Button tone="secondary" onClick={() => window.print()}>
            Print part
          </Button>
          <Link href={`/bands/${encodeURIComponent(bandId)}/import/parts?chart=${encodeURIComponent(chartId)}`} className={buttonClass("secondary")} data-testid="open-parts">
            PDF parts
          </Link>
          {can(membership?.role, "readBook") ? (
            <a href={`/api/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}/musicxml?instrument=${choices.instrument}`} className={buttonClass("secondary")} data-testid="export-musicxml" download>
              MusicXML
            </a>
          ) : null}
        </div>
      </div>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <section aria-label="Chart" className="min-w-0">
          <div ref={setBox} className="rounded-lg border border-paper-dim bg-white text-black shadow-sm">
            {performance?.ok ? (
              <PagedChart
                arrangement={performance.arrangement}
                text={performance.text}
                width={size.width}
                height={size.height}
                label={`${chart.title}, ${performance.text.partLabel}`}
                // A desk or laptop reads from closer than a stand: smaller pages, more lines each.
                layout={{ zoom: size.width >= 1000 ? 1.1 : 1, compact: true }}
                controls={controls}
                marks={marks}
                onView={(_, page, pages, atStart, atEnd) => setCounter({ page, pages, atStart, atEnd })}
              />
            ) : (
              <p role="alert" className="p-6 font-semibold text-red-800">
                {performance?.message ?? "Drawing…"}
              </p>
            )}
          </div>
          <div className="no-print mt-2 flex items-center justify-between gap-3">
            <Button tone="secondary" onClick={() => controls.current?.back()} disabled={counter.atStart} aria-label="Previous page">
              ← Page
            </Button>
            <span data-testid="page-counter" className="font-semibold tabular-nums">
              {counter.page} / {counter.pages}
            </span>
            <Button tone="secondary" onClick={() => controls.current?.next()} disabled={counter.atEnd} aria-label="Next page">
              Page →
            </Button>
          </div>
        </section>

        <aside className="no-print flex min-w-0 flex-col gap-5" aria-label="Reading choices">
          <ChangeSummary chartId={chartId} instrument={choices.instrument} tonightKey={choices.key} />
          <PlayerPanel chart={chart} concertKey={choices.key} intro={choices.intro} tempo={choices.tempo} host={() => box?.querySelector<HTMLElement>('[data-testid="chart-page"]') ?? null} />
          <InstrumentPicker value={choices.instrument} onChange={choices.setInstrument} />
          <KeyPicker chartKey={chart.key} value={choices.key ?? chart.key} onChange={choices.setKey} />
          <IntroPicker
            value={choices.intro === undefined ? (chart.intro ? "composed" : null) : (choices.intro?.kind ?? null)}
            options={intros}
            onChange={(kind) => choices.setIntro(kind ? { kind } : null)}
            part={{ chartKey: chart.key, concertKey: choices.key ?? chart.key, instrument: choices.instrument }}
          />
        </aside>
      </div>

      <div className="no-print mt-8 flex flex-col gap-6">
        <ChartMeta chart={local} />
        <MarksPanel bandId={bandId} chartId={chartId} chart={chart} chartRevision={local.revision} />
        <ChartHistory bandId={bandId} chartId={chartId} />
        <p className="text-sm text-ink-muted">
          Print or share parts only of music your band has the rights to; local copyright rules and licences apply.
        </p>
      </div>
      {performance?.ok ? <PrintSheets arrangement={performance.arrangement} text={performance.text} /> : null}
    </main>
  );
}
