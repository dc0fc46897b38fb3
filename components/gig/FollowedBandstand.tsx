"use client";
// The set's bandstand view on a gig: the bandstand itself, plus following the leader's calls, calling
// for the caller, the set's tunes with "changed" marks, and what changed in the tune on the stand.
import { useEffect, useMemo, useState } from "react";
import { Bandstand, type BandstandProps } from "@/components/bandstand/Bandstand";
import { StageChanges } from "@/components/changes/StageChanges";
import { useChangedCharts } from "@/components/changes/useChangeSince";
import { markChartSeen, useMembers, useMembership } from "@/lib/offline/hooks";
import { GigBar } from "./GigBar";
import { useGigFollow } from "./useGigFollow";
import { can } from "@/lib/band/roles";

export interface GigEntry {
  id: string;
  chartId: string;
  title: string;
  /** Tonight's concert key, when the set list moves the tune. */
  key: string | null;
}

interface Props extends BandstandProps {
  bandId: string;
  setlistId: string;
  /** One per tune, in the same order as `tunes`. */
  entries: GigEntry[];
}

export function FollowedBandstand({ bandId, setlistId, entries, ...stand }: Props) {
  const ids = useMemo(() => entries.map((e) => e.id), [entries]);
  const gig = useGigFollow(bandId, setlistId, ids);
  const membership = useMembership(bandId);
  const isLeader = can(membership?.role, "callTunes");
  const members = useMembers(isLeader ? bandId : null);
  const changed = useChangedCharts(bandId);
  // Where this device is: its own turns since the last call it jumped to, else that call's tune.
  const [own, setOwn] = useState<{ seq: number | null; index: number }>({ seq: null, index: stand.start ?? 0 });
  const jumpSeq = gig.jump?.seq ?? null;
  const at = own.seq === jumpSeq ? own.index : (gig.jump?.index ?? own.index);
  const chartId = entries[at]?.chartId;
  useEffect(() => {
    // The tune on the stand counts as read; its summary stays (components/changes keeps readFrom).
    if (chartId) void markChartSeen(chartId);
  }, [chartId]);

  const tunes = entries.map((e) => ({ title: e.title, changed: Boolean(changed?.has(e.chartId)) }));
  return (
    <>
      <Bandstand
        key={gig.jump?.seq ?? "own"}
        {...stand}
        start={gig.jump ? gig.jump.index : stand.start}
        startAt={gig.jump ? "first" : stand.startAt}
        following={gig.following}
        onTuneChange={(i, a) => {
          setOwn({ seq: jumpSeq, index: i });
          stand.onTuneChange?.(i, a);
        }}
        gigControls={<GigBar gig={gig} tunes={tunes} at={at} isLeader={isLeader} members={members} />}
      />
      <StageChanges chartId={chartId} instrument={stand.instrument} tonightKey={entries[at]?.key} />
    </>
  );
}
