// An arrangement as MusicXML: the bars a player reads (chosen intro, the form, a set list's tag ending),
// taken from the performance bars lib/chart builds, so the file and the drawn chart are one arrangement.
// The bars must be arranged in concert pitch (instrument "concert"); the part's transposition is the
// export's, as for a chart.
import type { Arrangement, Bar, Chart, PerformanceBar } from "@/lib/chart/model";
import { exportBars, type ExportBar, type ExportOptions } from "./export";

function barOf(pb: PerformanceBar): Bar {
  const bar: Bar = { chords: pb.chords, simile: pb.simile, repeatStart: pb.repeatStart, repeatEnd: pb.repeatEnd, ending: pb.ending };
  if (pb.repeatTimes !== undefined) bar.repeatTimes = pb.repeatTimes;
  if (pb.endingPasses) bar.endingPasses = pb.endingPasses;
  if (pb.melody) bar.melody = pb.melody;
  if (pb.pickup !== undefined) bar.pickup = pb.pickup;
  return bar;
}

export function exportArrangement(chart: Chart, arrangement: Arrangement, opts: ExportOptions = {}): string {
  if (arrangement.instrument !== "concert") throw new Error("exportArrangement takes an arrangement in concert pitch");
  const bars: ExportBar[] = arrangement.bars.map((pb) => ({ bar: barOf(pb), section: pb.section, sectionEnd: pb.barline !== "single" }));
  return exportBars({ ...chart, key: arrangement.concertKey, meter: arrangement.meter }, bars, opts);
}
