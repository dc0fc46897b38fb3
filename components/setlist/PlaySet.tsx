"use client";
// "Play this set": the whole night on the bandstand, tune after tune in play order, each with
// tonight's key, tempo and intro, in the reader's own instrument. Everything comes from this device.
import { useSearchParams } from "next/navigation";
import { useMemo } from "react";
import type { BandstandTune } from "@/components/bandstand/Bandstand";
import { FollowedBandstand } from "@/components/gig/FollowedBandstand";
import { Notice } from "@/components/ui/Notice";
import { useBandRoute } from "@/lib/offline/route";
import { isInstrumentId } from "@/lib/music/instruments";
import { partKeyInWords } from "@/lib/music/part-key";
import { endingInWords, entryIntro, entryIntroInWords, playOrder, type SetlistEntry } from "@/lib/setlist";
import { useBandCharts, useMembership, useSetlist } from "@/lib/offline/hooks";
import { useTuneMarks } from "@/components/marks/useBarMarks";

/** The line at the top of each tune: where it sits in the night and how it goes tonight. */
export function tuneHeading(e: SetlistEntry, title: string, chartKey: string, chartTempo: number | null, instrument = "concert"): string {
  const tempo = e.tempo ?? chartTempo;
  return [
    `Set ${e.setNumber} · ${e.position + 1}. ${title}`,
    `Key ${partKeyInWords(e.key ?? chartKey, instrument)}`,
    tempo ? `♩ = ${tempo}` : "",
    `Intro: ${entryIntroInWords(e)}`,
    e.ending ? `End: ${endingInWords(e.ending)}` : "",
  ]
    .filter(Boolean)
    .join(" · ");
}

export function PlaySet() {
  const { bandId, setlistId } = useBandRoute();
  const params = useSearchParams();
  const loaded = useSetlist(setlistId);
  const charts = useBandCharts(bandId, { copies: false });
  const membership = useMembership(bandId);
  const asked = params.get("instrument");
  const instrument = asked && isInstrumentId(asked) ? asked : (membership?.instrument ?? "concert");
  const start = Math.max(0, Number(params.get("tune") ?? 1) - 1) || 0;

  const order = useMemo(() => playOrder((loaded?.entries ?? []) as SetlistEntry[]), [loaded]);
  const byId = useMemo(() => new Map((charts ?? []).map((c) => [c.id, c])), [charts]);
  const marks = useTuneMarks(order.map((e) => e.chartId), byId);
  const tunes = useMemo<BandstandTune[]>(
    () =>
      order.flatMap((e, i) => {
        const c = byId.get(e.chartId);
        if (!c) return [];
        const next = order[i + 1];
        const nextTitle = next ? byId.get(next.chartId)?.title : undefined;
        return [
          {
            chart: { ...c.body, tempo: e.tempo ?? c.body.tempo },
            key: e.key,
            intro: entryIntro(e),
            tag: e.ending?.kind === "tag" ? { bars: e.ending.bars, times: e.ending.times } : null,
            label: tuneHeading(e, c.title, c.body.key, c.body.tempo, instrument),
            next: nextTitle ? `Next: ${nextTitle}` : undefined,
            nextTitle,
            introText: entryIntroInWords(e),
            marks: marks.get(e.chartId),
            ending: e.ending,
          },
        ];
      }),
    [order, byId, marks, instrument],
  );

  if (!bandId || !setlistId) return null;
  const exit = `/bands/${encodeURIComponent(bandId)}/setlists/${encodeURIComponent(setlistId)}`;
  if (loaded === undefined || charts === undefined) return <p className="p-6 text-ink-muted">Opening the set…</p>;
  if (loaded === null || tunes.length === 0) {
    return (
      <Notice kind="error" className="m-6" title={loaded === null ? "This set list is not on this device" : "No tunes to play"}>
        <a href={exit} className="underline">Back</a>
      </Notice>
    );
  }
  // One gig entry per tune drawn (a chart missing on this device is skipped in both).
  const gigEntries = order.flatMap((e) => {
    const c = byId.get(e.chartId);
    return c ? [{ id: e.id, chartId: e.chartId, title: c.title, key: e.key }] : [];
  });
  return (
    <FollowedBandstand bandId={bandId} setlistId={setlistId} entries={gigEntries} tunes={tunes} instrument={instrument} start={Math.min(start, tunes.length - 1)} exitHref={exit}
      onTuneChange={(i) => {
        // The place in the set lives in the address, so a reload (or a worker-served shell) reopens this tune.
        const q = new URLSearchParams(window.location.search);
        q.set("tune", String(i + 1));
        window.history.replaceState(window.history.state, "", `${window.location.pathname}?${q.toString()}`);
      }}
    />
  );
}
