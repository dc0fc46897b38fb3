// The intro generator's verdict for the arrangement editor: does this kind of intro suit the top of
// the form, and if not, what would. The generator (lib/chart) does the music; this only adapts it.
import type { Chart, IntroChoice } from "@/lib/chart/model";
import { describeIntroKind, type IntroAnalyser } from "@/lib/setlist";

export const analyseIntro: IntroAnalyser = (chart: Chart, choice: IntroChoice) => {
  if (choice.kind === "composed") {
    return chart.intro ? { fits: true, advice: "The chart's own intro, as written.", suggestions: [] } : { fits: false, advice: "This chart has no composed intro.", suggestions: ["dominant-pedal", "last-bars"] };
  }
  return { fits: true, advice: `A ${describeIntroKind(choice.kind)} into the top of the form.`, suggestions: [] };
};
