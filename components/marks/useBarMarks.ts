"use client";
// This player's marks, ready for the renderer: per chart, keyed by the bar's place in the chart
// (`PerformanceBar.source`). Marks live only on their owner's devices, so nobody else's show.
import { useMemo } from "react";
import type { Chart } from "@/lib/chart/model";
import { marksByBar, type BarMark } from "@/lib/setlist";
import { useMyMarks } from "@/lib/offline/hooks";

export type BarMarks = ReadonlyMap<string, BarMark>;

export function useTuneMarks(chartIds: readonly string[], charts: ReadonlyMap<string, { body: Chart }>): Map<string, BarMarks> {
  const ids = useMemo(() => [...new Set(chartIds)], [chartIds]);
  const marks = useMyMarks(ids);
  return useMemo(() => {
    const out = new Map<string, BarMarks>();
    for (const id of ids) {
      const chart = charts.get(id)?.body;
      const mine = (marks ?? []).filter((m) => m.chartId === id && !m.data.lost).map((m) => m.data);
      if (chart && mine.length > 0) out.set(id, marksByBar(chart, mine));
    }
    return out;
  }, [ids, charts, marks]);
}

export function useChartMarks(chartId: string | null, chart: Chart | null | undefined): BarMarks | undefined {
  const ids = useMemo(() => (chartId ? [chartId] : []), [chartId]);
  const byId = useMemo(() => new Map(chartId && chart ? [[chartId, { body: chart }]] : []), [chartId, chart]);
  return useTuneMarks(ids, byId).get(chartId ?? "");
}
