"use client";
// How one tune is played tonight: concert key, tempo, intro (with the generator's verdict while
// choosing), ending, solo order and a note. Every control is labelled; refusals sit under their field.
import { useId } from "react";
import { Field, SelectField } from "@/components/ui/Field";
import { INTRO_KINDS, type Chart, type IntroChoice, type IntroKind } from "@/lib/chart/model";
import { MAJOR_KEYS, MINOR_KEYS } from "@/lib/music/keys";
import { keyInWords } from "@/lib/music/part-key";
import {
  checkArrangement,
  describeIntroKind,
  ENDING_KINDS,
  isMinorKey,
  type EndingChoice,
  type EndingKind,
  type SetlistEntry,
} from "@/lib/setlist";
import { analyseInKey, analyseIntro } from "./intro-fit";


const ENDING_WORDS: Record<EndingKind, string> = {
  "as-written": "As written on the chart",
  tag: "Tag the last bars",
  ritardando: "Ritardando",
  cold: "Cold ending",
  "vamp-out": "Vamp out",
};

function defaultEnding(kind: EndingKind): EndingChoice {
  switch (kind) {
    case "tag":
      return { kind, bars: 4, times: 3 };
    case "ritardando":
    case "vamp-out":
      return { kind, bars: 2 };
    default:
      return { kind };
  }
}

/**
 * One "as written" entry only: the chart's own intro when it has one (with a way to skip it), else
 * straight in at the top. The composed kind is that first entry, never listed twice.
 */
function introOptions(chart: Chart | null): { value: string; label: string }[] {
  const kinds = INTRO_KINDS.filter((k) => k !== "composed").map((k) => ({ value: k, label: describeIntroKind(k) }));
  if (chart?.intro && chart.intro.bars.length > 0) {
    return [
      { value: "", label: `The chart's own intro (${chart.intro.bars.length} bars)` },
      { value: "none", label: "No intro, straight in at the top" },
      ...kinds,
    ];
  }
  return [{ value: "", label: "No intro, straight in at the top" }, ...kinds];
}

function num(v: string): number | undefined {
  const n = Number(v);
  return v.trim() === "" || !Number.isFinite(n) ? undefined : Math.round(n);
}

export function TuneArrangement({ entry, chart, onChange }: { entry: SetlistEntry; chart: Chart | null; onChange: (e: SetlistEntry) => void }) {
  const uid = useId();
  const check = checkArrangement(chart, entry, chart ? analyseIntro : undefined);
  const err = (field: string) => check.issues.find((i) => i.field === field)?.message ?? null;
  const keys = chart && isMinorKey(chart.key) ? MINOR_KEYS : MAJOR_KEYS;
  const intro = entry.intro;
  const setIntro = (patch: Partial<IntroChoice> | null) =>
    onChange({ ...entry, intro: patch === null ? null : ({ ...(intro ?? { kind: "dominant-pedal" }), ...patch } as IntroChoice) });
  const ending = entry.ending;
  const fit = chart && intro && !check.issues.some((i) => i.field.startsWith("intro")) ? analyseInKey(chart, entry.key, intro) : null;

  return (
    <div className="grid gap-4 sm:grid-cols-2" data-testid="tune-arrangement">
      <SelectField
        label="Concert key tonight"
        value={entry.key ?? ""}
        error={err("key")}
        hint={chart ? `The chart is in ${chart.key}. Every part is transposed from this key.` : undefined}
        onChange={(e) => onChange({ ...entry, key: e.target.value || null })}
        options={[
          { value: "", label: chart ? `As written (${keyInWords(chart.key)})` : "As written" },
          ...keys.filter((k) => k !== chart?.key).map((k) => ({ value: k, label: keyInWords(k) })),
        ]}
        data-testid="tune-key"
      />
      <Field
        label="Tempo (beats per minute)"
        type="number"
        inputMode="numeric"
        min={20}
        max={400}
        value={entry.tempo ?? ""}
        placeholder={chart?.tempo ? String(chart.tempo) : "as written"}
        onChange={(e) => onChange({ ...entry, tempo: num(e.target.value) ?? null })}
        data-testid="tune-tempo"
      />

      <fieldset className="rounded-md border border-ink-soft p-3 sm:col-span-2">
        <legend className="px-1 font-semibold">Intro</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField
            label="How the tune starts"
            value={entry.straightIn ? "none" : intro && intro.kind !== "composed" ? intro.kind : ""}
            error={err("intro.kind")}
            onChange={(e) => {
              const kind = e.target.value as IntroKind | "none" | "";
              // A new kind starts from its own defaults, not the options of the previous one.
              const next: IntroChoice | null = kind === "" || kind === "none" ? null : kind === "turnaround" ? { kind, variant: "I-vi-ii-V" } : { kind };
              onChange({ ...entry, intro: next, straightIn: kind === "none" });
            }}
            options={introOptions(chart)}
            data-testid="intro-kind"
          />
          {intro && intro.kind !== "composed" && intro.kind !== "solo-chorus" ? (
            <Field
              label="Bars"
              type="number"
              min={1}
              max={64}
              value={intro.bars ?? ""}
              placeholder="default"
              error={err("intro.bars")}
              onChange={(e) => setIntro({ bars: num(e.target.value) })}
              data-testid="intro-bars"
            />
          ) : null}
          {intro && intro.kind !== "composed" ? (
            <Field
              label="Times through"
              type="number"
              min={1}
              max={16}
              value={intro.repeats ?? ""}
              placeholder="1"
              onChange={(e) => setIntro({ repeats: num(e.target.value) })}
              data-testid="intro-repeats"
            />
          ) : null}
          {intro?.kind === "turnaround" ? (
            <SelectField
              label="Which turnaround"
              value={intro.variant ?? "I-vi-ii-V"}
              onChange={(e) => setIntro({ variant: e.target.value as IntroChoice["variant"] })}
              options={[{ value: "I-vi-ii-V", label: "I–vi–ii–V" }, { value: "iii-VI-ii-V", label: "iii–VI–ii–V" }]}
            />
          ) : null}
          {intro?.kind === "vamp" ? (
            <div className="grid grid-cols-2 gap-2">
              {[0, 1].map((i) => (
                <Field
                  key={i}
                  label={`Vamp chord ${i + 1} (concert)`}
                  value={intro.vamp?.[i] ?? ""}
                  error={i === 0 ? err("intro.vamp") : null}
                  onChange={(e) => {
                    const v: [string, string] = [intro.vamp?.[0] ?? "", intro.vamp?.[1] ?? ""];
                    v[i] = e.target.value;
                    setIntro({ vamp: v[0] || v[1] ? v : undefined });
                  }}
                />
              ))}
            </div>
          ) : null}
          {intro && intro.kind !== "composed" ? (
            <label className="flex min-h-11 items-center gap-2" htmlFor={`${uid}-tt`}>
              <input
                id={`${uid}-tt`}
                type="checkbox"
                className="h-5 w-5"
                checked={intro.tritoneSub ?? false}
                onChange={(e) => setIntro({ tritoneSub: e.target.checked || undefined })}
              />
              Tritone substitutes for the dominants
            </label>
          ) : null}
        </div>
        <p aria-live="polite" className="mt-2 text-sm" data-testid="intro-fit">
          {fit ? (
            <span className={fit.fits ? "text-emerald-900" : "font-semibold text-red-800"}>
              {fit.fits ? "Fits: " : "Does not fit well: "}
              {fit.advice}
              {!fit.fits && fit.suggestions.length ? ` Try: ${fit.suggestions.map(describeIntroKind).join(", ")}.` : ""}
            </span>
          ) : null}
        </p>
      </fieldset>

      <fieldset className="rounded-md border border-ink-soft p-3 sm:col-span-2">
        <legend className="px-1 font-semibold">Ending</legend>
        <div className="grid gap-3 sm:grid-cols-3">
          <SelectField
            label="How the tune ends"
            value={ending?.kind ?? ""}
            onChange={(e) => onChange({ ...entry, ending: e.target.value ? defaultEnding(e.target.value as EndingKind) : null })}
            options={[{ value: "", label: "As written on the chart" }, ...ENDING_KINDS.filter((k) => k !== "as-written").map((k) => ({ value: k, label: ENDING_WORDS[k] }))]}
            data-testid="ending-kind"
          />
          {ending && "bars" in ending ? (
            <Field
              label="Over the last … bars"
              type="number"
              min={1}
              max={16}
              value={ending.bars}
              error={err("ending.bars")}
              onChange={(e) => onChange({ ...entry, ending: { ...ending, bars: num(e.target.value) ?? 1 } })}
            />
          ) : null}
          {ending?.kind === "tag" ? (
            <Field
              label="Extra times"
              type="number"
              min={1}
              max={8}
              value={ending.times}
              onChange={(e) => onChange({ ...entry, ending: { ...ending, times: num(e.target.value) ?? 1 } })}
            />
          ) : null}
        </div>
      </fieldset>

      <Field
        label="Solo order"
        value={entry.soloOrder}
        placeholder="tenor, piano, bass"
        maxLength={200}
        onChange={(e) => onChange({ ...entry, soloOrder: e.target.value })}
        data-testid="tune-solos"
      />
      <Field
        label="Choruses each soloist takes"
        type="number"
        inputMode="numeric"
        min={1}
        max={16}
        value={entry.choruses}
        hint="Counts toward the set's length."
        onChange={(e) => onChange({ ...entry, choruses: Math.min(16, Math.max(1, num(e.target.value) ?? 1)) })}
        data-testid="tune-choruses"
      />
      <Field
        label="Note for the band"
        value={entry.notes}
        placeholder="drums 4 bars before the head out"
        maxLength={500}
        onChange={(e) => onChange({ ...entry, notes: e.target.value })}
        data-testid="tune-note"
      />
      {check.issues.length > 0 ? (
        <p role="alert" className="text-sm font-semibold text-red-800 sm:col-span-2" data-testid="tune-problems">
          {check.issues.map((i) => i.message).join(" ")}
        </p>
      ) : null}
    </div>
  );
}
