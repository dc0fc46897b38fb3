"use client";
// The reading choices on the chart page: the part (instrument), a singer's key, and how the tune starts.
import { useId } from "react";
import type { IntroKind, IntroResult } from "@/lib/chart/model";
import { prettyMusic, type IntroReader } from "@/lib/chart/intro-reader";
import { INSTRUMENT_IDS, INSTRUMENTS } from "@/lib/music/instruments";
import { transposeChord, transposeChordToKey } from "@/lib/music";
import { MAJOR_KEYS, MINOR_KEYS } from "@/lib/music/keys";
import { keyNameInWords } from "@/lib/music/part-key";
import { CONTROL } from "@/components/ui/Field";
import { cx } from "@/components/ui/cx";

export function InstrumentPicker({ value, onChange }: { value: string; onChange: (id: string) => void }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        Part
      </label>
      <select id={id} data-testid="instrument-picker" className={CONTROL} value={value} onChange={(e) => onChange(e.target.value)}>
        {INSTRUMENT_IDS.map((i) => (
          <option key={i} value={i}>
            {INSTRUMENTS[i].label}
          </option>
        ))}
      </select>
    </div>
  );
}


/** Concert key to play in (a singer's key); the chart's own key is the first choice. */
export function KeyPicker({ chartKey, value, onChange }: { chartKey: string; value: string; onChange: (key: string | null) => void }) {
  const id = useId();
  const minor = /m$/.test(chartKey);
  const keys = minor ? MINOR_KEYS : MAJOR_KEYS;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        Concert key
      </label>
      <select
        id={id}
        data-testid="key-picker"
        className={CONTROL}
        value={value}
        onChange={(e) => onChange(e.target.value === chartKey ? null : e.target.value)}
      >
        <option value={chartKey}>{keyNameInWords(chartKey)} (as written)</option>
        {keys
          .filter((k) => k !== chartKey)
          .map((k) => (
            <option key={k} value={k}>
              {keyNameInWords(k)}
            </option>
          ))}
      </select>
    </div>
  );
}

export const INTRO_NAMES: Record<IntroKind, string> = {
  "dominant-pedal": "Dominant pedal (sus)",
  "last-bars": "Last bars of the form",
  vamp: "Two-chord vamp",
  "solo-chorus": "Solo chorus first",
  turnaround: "Turnaround",
  "two-five": "ii–V into the top",
  composed: "The tune's own intro",
};

/** Where the intro chords were worked out (the chart's key) and how this player reads them. */
export interface PreviewPart {
  chartKey: string;
  /** Concert key in play tonight (a singer's key), or the chart's. */
  concertKey: string;
  instrument: string;
}

/** A chord as the player reads it: moved to tonight's concert key, then to the part's key. */
export function readChord(symbol: string, part: PreviewPart): string {
  try {
    const concert = part.concertKey === part.chartKey ? symbol : transposeChordToKey(symbol, part.chartKey, part.concertKey);
    return transposeChord(concert, part.concertKey, part.instrument);
  } catch {
    return symbol; // a symbol the music core cannot read is shown as written
  }
}

/** The intro advice's reader for this part: every chord, note and key as the player reads it, ♭/♯ spelled. */
export function partReader(part: PreviewPart): IntroReader {
  const read = (s: string) => prettyMusic(readChord(s, part));
  return { chord: read, note: read, key: read };
}

function previewBars(result: IntroResult, part: PreviewPart): string[] {
  return result.bars.slice(0, 8).map((b) => (b.simile ? "%" : b.chords.map((c) => readChord(c.symbol, part)).join(" ")));
}

/** Each intro kind with what the analysis says about it for this tune, and its chords in the player's part. */
export function IntroPicker({
  value,
  options,
  onChange,
  part,
}: {
  value: IntroKind | null;
  options: IntroResult[];
  onChange: (kind: IntroKind | null) => void;
  part: PreviewPart;
}) {
  const name = useId();
  return (
    <fieldset data-testid="intro-picker" className="flex min-w-0 flex-col gap-2">
      <legend className="mb-1 font-semibold">How it starts</legend>
      <label className={cx("flex min-w-0 gap-3 rounded-md border p-3", value === null ? "border-brass bg-brass-light/40" : "border-paper-dim")}>
        <input type="radio" name={name} value="" checked={value === null} onChange={() => onChange(null)} className="mt-1 size-5 shrink-0" />
        <span>
          <span className="font-semibold">Straight from the top</span>
          <span className="block text-sm text-ink-muted">No intro: the count-off, then bar 1.</span>
        </span>
      </label>
      {options.map((o) => (
        <label
          key={o.kind}
          data-kind={o.kind}
          data-fits={o.fits}
          className={cx("flex min-w-0 gap-3 rounded-md border p-3", value === o.kind ? "border-brass bg-brass-light/40" : "border-paper-dim")}
        >
          <input type="radio" name={name} value={o.kind} checked={value === o.kind} onChange={() => onChange(o.kind)} className="mt-1 size-5 shrink-0" />
          <span className="min-w-0 flex-1 [overflow-wrap:anywhere]">
            <span className="font-semibold">{INTRO_NAMES[o.kind]}</span>{" "}
            <span className={cx("text-sm font-semibold", o.fits ? "text-green-800" : "text-red-800")}>{o.fits ? "suits this tune" : "doesn't suit"}</span>
            <span className="block text-sm text-ink-muted">{o.advice}</span>
            {o.bars.length ? (
              // One bar a chip, wrapping onto new lines on a narrow phone (never a sideways scroll).
              <span className="mt-1 flex flex-wrap gap-x-2 gap-y-1 font-mono text-sm" data-testid="intro-preview">
                {previewBars(o, part).map((bar, i) => (
                  <span key={i} className="[overflow-wrap:anywhere]">
                    | {bar}
                  </span>
                ))}
                <span>|{o.bars.length > 8 ? ` … ${o.bars.length} bars` : ""}</span>
              </span>
            ) : null}
          </span>
        </label>
      ))}
    </fieldset>
  );
}
