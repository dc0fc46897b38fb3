// The intro generator's verdict for the arrangement editor: does this kind of intro suit the top of
// the form, and if not, what would. The generator (lib/chart) does the music; this only adapts it.
import { generateIntro, transposeChart } from "@/lib/chart";
import type { Chart, IntroChoice } from "@/lib/chart/model";
import type { IntroAnalyser } from "@/lib/setlist";

export const analyseIntro: IntroAnalyser = (chart: Chart, choice: IntroChoice) => {
  try {
    const r = generateIntro(chart, choice);
    return { fits: r.fits, advice: r.advice, suggestions: r.suggestions };
  } catch (err) {
    return { fits: false, advice: err instanceof Error ? err.message : "This intro cannot be built for this chart.", suggestions: [] };
  }
};

/** The verdict in tonight's key, so the advice names the chords the band will actually play. */
export function analyseInKey(chart: Chart, key: string | null, choice: IntroChoice) {
  let inKey = chart;
  try {
    if (key) inKey = transposeChart(chart, key);
  } catch {
    inKey = chart;
  }
  return analyseIntro(inKey, choice);
}
