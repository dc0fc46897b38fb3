"use client";
// How long a set runs against the length the leader wants ("Set 1: 47 min of 45"), worked out live
// from each tune's tempo, form, intro, solo order and ending (lib/setlist/duration).
import { useId } from "react";
import { setLengthInWords, setTiming, tuneTiming, type SetlistEntry } from "@/lib/setlist";
import type { TuneInfo } from "./SetTunes";

interface Props {
  setNumber: number;
  entries: SetlistEntry[];
  tunes: Map<string, TuneInfo>;
  target: number | null;
  /** Given to leaders and arrangers: sets the length they want. */
  onTarget?: (minutes: number | null) => void;
}

export function SetLength({ setNumber, entries, tunes, target, onTarget }: Props) {
  const id = useId();
  const timings = entries.flatMap((e) => {
    const chart = tunes.get(e.chartId)?.chart;
    return chart ? [tuneTiming(chart, e)] : [];
  });
  const { seconds, untimed } = setTiming(timings);
  const over = target !== null && Math.round(seconds / 60) > target;
  return (
    <div className="mb-3 flex flex-wrap items-end gap-x-4 gap-y-2">
      <p className={over ? "font-semibold text-red-800" : "font-semibold"} data-testid={`set-length-${setNumber}`} aria-live="polite">
        {setLengthInWords(setNumber, seconds, target)}
        {over ? " (over: trim a tune or a solo)" : ""}
        {untimed ? ` · ${untimed} ${untimed === 1 ? "tune has" : "tunes have"} no tempo, not counted` : ""}
      </p>
      {onTarget ? (
        <span className="flex items-center gap-2">
          <label htmlFor={id} className="text-sm">
            Length you want for set {setNumber} (minutes)
          </label>
          <input
            id={id}
            type="number"
            inputMode="numeric"
            min={5}
            max={240}
            className="min-h-11 w-24 rounded-md border border-ink-muted bg-white px-2"
            value={target ?? ""}
            onChange={(e) => {
              const n = Math.round(Number(e.target.value));
              onTarget(e.target.value.trim() === "" || !Number.isFinite(n) || n < 1 ? null : n);
            }}
            data-testid={`set-target-${setNumber}`}
          />
        </span>
      ) : null}
    </div>
  );
}
