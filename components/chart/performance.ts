// From a chart and the reader's choices to what gets laid out: the arrangement and the page text.
import type { Arrangement, Chart, IntroChoice, TagEnding } from "@/lib/chart/model";
import { arrange } from "@/lib/chart";
import { partLabel } from "@/lib/render/part-label";
import { keyNameInWords } from "@/lib/music/part-key";
import type { PageText } from "./engrave";

export interface PerformanceChoice {
  chart: Chart;
  instrument: string;
  key?: string | null;
  /** undefined plays the chart's composed intro if it has one; null none. */
  intro?: IntroChoice | null;
  /** Tonight's tag ending, drawn after the form. */
  tag?: TagEnding | null;
}

export interface Performance {
  arrangement: Arrangement;
  text: PageText;
}

export function buildPerformance(choice: PerformanceChoice): Performance {
  const arrangement = arrange(choice.chart, {
    instrument: choice.instrument,
    key: choice.key ?? undefined,
    intro: choice.intro,
    tag: choice.tag ?? null,
  });
  const c = choice.chart;
  const details = [c.feel, c.tempo ? `♩ = ${c.tempo}` : "", `Key of ${keyNameInWords(arrangement.writtenKey)}`].filter(Boolean).join(" · ");
  return {
    arrangement,
    text: { title: c.title, composer: c.composer, details, partLabel: partLabel(choice.instrument) },
  };
}
