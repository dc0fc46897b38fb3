"use client";
// The bandstand view's route shell: the chart (and, with ?list=, the tunes around it) from the local
// book, the reader's part, key and intro from the address.
import { useSearchParams } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import { PartOnStand } from "@/components/pdf";
import { markChartSeen, useBandCharts, useChart, useMembership } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { chartQuery } from "@/components/chart/params";
import { useChoices } from "@/components/chart/useChoices";
import { StageChanges } from "@/components/changes/StageChanges";
import { Bandstand, type BandstandTune } from "./Bandstand";

export function BandstandScreen() {
  const { bandId, chartId } = useBandRoute();
  const local = useChart(bandId, chartId);
  const charts = useBandCharts(bandId);
  const membership = useMembership(bandId);
  const choices = useChoices(bandId, membership?.instrument);
  // Moving to another tune of the list changes the address and so remounts the view; this keeps
  // which page it should open at (the last one when backing into the tune before).
  const [enterAt, setEnterAt] = useState<"first" | "last">("first");
  // ?part=<id>: read one of the chart's PDF or image parts instead of the engraved chart.
  const partId = useSearchParams().get("part");

  useEffect(() => {
    if (chartId && local) void markChartSeen(chartId);
  }, [chartId, local]);

  const ids = useMemo(() => (choices.list ? choices.list.split(",").map((s) => s.trim()).filter(Boolean) : []), [choices.list]);
  const { tunes, start } = useMemo(() => {
    if (!local) return { tunes: [] as BandstandTune[], start: 0 };
    const own: BandstandTune = { chart: local.body, key: choices.key, intro: choices.intro, tag: choices.tag };
    if (ids.length < 2 || !charts) return { tunes: [own], start: 0 };
    const byId = new Map(charts.map((c) => [c.id, c]));
    const listed = ids.flatMap((id) => {
      if (id === local.id) return [{ id, tune: own }];
      const c = byId.get(id);
      return c ? [{ id, tune: { chart: c.body } as BandstandTune }] : [];
    });
    const at = listed.findIndex((t) => t.id === local.id);
    if (at < 0) return { tunes: [own], start: 0 };
    const tunes = listed.map((t, i) => ({ ...t.tune, label: `${i + 1}. ${t.tune.chart.title}`, nextTitle: listed[i + 1]?.tune.chart.title }));
    return { tunes, start: at };
  }, [local, charts, ids, choices.key, choices.intro, choices.tag]);

  if (!bandId || !chartId) return null;
  if (local === undefined) return <p className="p-6">Opening the chart…</p>;
  const base = `/bands/${encodeURIComponent(bandId)}/charts`;
  if (local === null) {
    return (
      <p role="alert" className="p-6">
        This chart is not in your book on this device. <a href={`/bands/${encodeURIComponent(bandId)}`}>Back to the library</a>
      </p>
    );
  }
  if (partId) {
    return <PartOnStand chartId={local.id} chartTitle={local.title} partId={partId} exitHref={`/bands/${encodeURIComponent(bandId)}/import/parts?chart=${encodeURIComponent(chartId)}`} />;
  }
  const listedIds = ids.filter((id) => id === local.id || charts?.some((c) => c.id === id));
  return (
    <>
      <StageChanges chartId={local.id} instrument={choices.instrument} tonightKey={choices.key} />
      <Bandstand
        key={`${local.id}:${choices.instrument}`}
        tunes={tunes}
        start={start}
        startAt={enterAt}
        instrument={choices.instrument}
        exitHref={`${base}/${encodeURIComponent(chartId)}${choices.query}`}
        onTuneChange={(i, at) => {
          setEnterAt(at);
          // Keep the address on the tune being read, so a reload (or the service worker) reopens it.
          const id = listedIds[i];
          if (id) {
            const q = chartQuery({ instrument: choices.instrument, list: choices.list });
            window.history.replaceState(null, "", `${base}/${encodeURIComponent(id)}/bandstand${q}`);
          }
        }}
      />
    </>
  );
}
