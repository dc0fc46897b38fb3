"use client";
// The revision a player read before the one on this device, and that old chart, from the local book:
// a chart marked "changed" compares with the revision last opened; one just opened, with the one
// read before it (kept as readFrom when it was opened). Works offline: history travels with the chart.
import { useLiveQuery } from "dexie-react-hooks";
import { parseChartText } from "@/lib/chart";
import type { Chart } from "@/lib/chart/model";
import { getLocalBook } from "@/lib/offline/db";

export interface ChangeSince {
  from: number;
  to: number;
  before: Chart | null;
  after: Chart;
  author: string;
}

export function useChangeSince(chartId: string | null | undefined): ChangeSince | null | undefined {
  return useLiveQuery(async () => {
    if (!chartId) return null;
    const book = getLocalBook();
    const row = await book.charts.get(chartId);
    if (!row || row.deleted) return null;
    const from = row.unseen ? row.seenRevision : (row.readFrom ?? 0);
    if (from <= 0 || from >= row.revision) return null;
    const old = await book.revisions.get([chartId, from]);
    let before: Chart | null = null;
    try {
      before = old ? parseChartText(old.sourceText) : null;
    } catch {
      before = null;
    }
    return { from, to: row.revision, before, after: row.body, author: row.updatedBy.name };
  }, [chartId]);
}

/** Whether each chart changed since this device last read it (the "changed" marks in lists). */
export function useChangedCharts(bandId: string | null | undefined): Set<string> | undefined {
  return useLiveQuery(async () => {
    if (!bandId) return new Set<string>();
    const rows = await getLocalBook().charts.where("bandId").equals(bandId).toArray();
    return new Set(rows.filter((r) => r.unseen && !r.deleted).map((r) => r.id));
  }, [bandId]);
}
