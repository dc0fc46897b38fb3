// Checks one tune's arrangement against its chart before it goes on the set list.
// Hard problems are refused with a reason a musician can act on; a poor intro fit is only a warning,
// because the leader may want it anyway.
import type { Chart, IntroChoice, IntroKind } from "@/lib/chart/model";
import type { EndingChoice, SetlistEntry } from "./model";

export interface ArrangementIssue {
  field: string;
  message: string;
}

export interface ArrangementCheck {
  ok: boolean;
  /** Refusals: the entry cannot be saved like this. */
  issues: ArrangementIssue[];
  /** Advice: allowed, but the leader should know. */
  warnings: ArrangementIssue[];
}

/** The intro generator's verdict, passed in so this module stays independent of how it is computed. */
export type IntroAnalyser = (chart: Chart, choice: IntroChoice) => { fits: boolean; advice: string; suggestions: IntroKind[] };

export function formLength(chart: Chart): number {
  return chart.sections.reduce((n, s) => n + s.bars.length, 0);
}

export function isMinorKey(key: string): boolean {
  return /m$/.test(key.trim());
}

const KIND_WORDS: Record<IntroKind, string> = {
  "dominant-pedal": "dominant pedal",
  "last-bars": "last bars of the form",
  vamp: "two-chord vamp",
  "solo-chorus": "solo chorus",
  turnaround: "turnaround",
  "two-five": "ii–V into the top",
  composed: "the chart's composed intro",
};

export function describeIntroKind(kind: IntroKind): string {
  return KIND_WORDS[kind];
}

function checkIntro(chart: Chart, intro: IntroChoice, issues: ArrangementIssue[]): void {
  if (intro.kind === "composed" && (!chart.intro || chart.intro.bars.length === 0)) {
    issues.push({
      field: "intro.kind",
      message: `“${chart.title}” has no composed intro. Choose another intro, such as a dominant pedal, the last bars of the form or a turnaround.`,
    });
  }
  const form = formLength(chart);
  if (intro.kind === "last-bars" && intro.bars !== undefined && intro.bars > form) {
    issues.push({
      field: "intro.bars",
      message: `The form is only ${form} bars long, so the intro cannot take its last ${intro.bars}.`,
    });
  }
  if (intro.kind === "vamp" && intro.vamp && intro.vamp.some((c) => c.trim() === "")) {
    issues.push({ field: "intro.vamp", message: "Give both chords of the vamp." });
  }
}

function checkEnding(chart: Chart, ending: EndingChoice, issues: ArrangementIssue[]): void {
  const form = formLength(chart);
  if ((ending.kind === "tag" || ending.kind === "ritardando" || ending.kind === "vamp-out") && ending.bars > form) {
    issues.push({
      field: "ending.bars",
      message: `The form is only ${form} bars long; the ending cannot use its last ${ending.bars}.`,
    });
  }
}

function checkKey(chart: Chart, key: string, issues: ArrangementIssue[]): void {
  if (isMinorKey(chart.key) !== isMinorKey(key)) {
    issues.push({
      field: "key",
      message: isMinorKey(chart.key)
        ? `“${chart.title}” is in a minor key (${chart.key}); give a minor key such as ${key.replace(/m?$/, "m")}.`
        : `“${chart.title}” is in a major key (${chart.key}); give a major key such as ${key.replace(/m$/, "")}.`,
    });
  }
}

/** Checks an entry against the chart it points at. `chart` null means the chart is gone from the book. */
export function checkArrangement(
  chart: Chart | null,
  entry: Pick<SetlistEntry, "key" | "intro" | "ending">,
  analyse?: IntroAnalyser,
): ArrangementCheck {
  const issues: ArrangementIssue[] = [];
  const warnings: ArrangementIssue[] = [];
  if (!chart) {
    return { ok: false, issues: [{ field: "chartId", message: "That chart is not in the band's book any more." }], warnings };
  }
  if (entry.key) checkKey(chart, entry.key, issues);
  if (entry.intro) checkIntro(chart, entry.intro, issues);
  if (entry.ending) checkEnding(chart, entry.ending, issues);
  if (entry.intro && analyse && !issues.some((i) => i.field.startsWith("intro"))) {
    const verdict = analyse(chart, entry.intro);
    if (!verdict.fits) warnings.push({ field: "intro.kind", message: verdict.advice });
  }
  return { ok: issues.length === 0, issues, warnings };
}

/** A few words for the printed set list and the bandstand header: "Intro: dominant pedal, 4 bars". */
export function introInWords(intro: IntroChoice | null): string {
  if (!intro) return "as written";
  const parts: string[] = [KIND_WORDS[intro.kind]];
  if (intro.kind === "turnaround") parts[0] = `${intro.variant ?? "I-vi-ii-V"} turnaround`;
  if (intro.kind === "vamp" && intro.vamp) parts[0] = `vamp ${intro.vamp[0]}–${intro.vamp[1]}`;
  if (intro.bars) parts.push(`${intro.bars} bars`);
  if (intro.repeats && intro.repeats > 1) parts.push(`×${intro.repeats}`);
  if (intro.tritoneSub) parts.push("tritone subs");
  return parts.join(", ");
}

export function endingInWords(ending: EndingChoice | null): string {
  if (!ending) return "as written";
  switch (ending.kind) {
    case "as-written":
      return "as written";
    case "tag":
      return `tag last ${ending.bars} bar${ending.bars === 1 ? "" : "s"} ×${ending.times}`;
    case "ritardando":
      return `rit. over the last ${ending.bars} bar${ending.bars === 1 ? "" : "s"}`;
    case "cold":
      return "cold ending";
    case "vamp-out":
      return `vamp out on the last ${ending.bars} bar${ending.bars === 1 ? "" : "s"}`;
  }
}

/** Tonight's intro for the performance: `null` none (straight in), `undefined` the chart's own default. */
export function entryIntro(e: Pick<SetlistEntry, "intro"> & { straightIn?: boolean }): IntroChoice | null | undefined {
  if (e.straightIn) return null;
  return e.intro ?? undefined;
}

/** `introInWords` for a set-list entry, saying so when the band goes straight in at the top. */
export function entryIntroInWords(e: Pick<SetlistEntry, "intro"> & { straightIn?: boolean }): string {
  return e.straightIn ? "none, straight in at the top" : introInWords(e.intro);
}
