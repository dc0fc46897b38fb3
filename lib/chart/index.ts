// Pedalpoint's chart core: the chart model, its text format, intros and what each player reads.
export * from "./model";
export { parseChartText, assertChartTextSize, METADATA_FIELDS, MAX_CHART_TEXT_CHARS, MAX_CHART_TEXT_LINES } from "./text-parse";
export { ChartTextError } from "./text-error";
export { serializeChart, BARS_PER_LINE } from "./text-serialize";
export { readMelodyNote, formatMelodyNote, noteQuarters, barQuarters } from "./melody";
export { analyseTop, barsAsPlayed, firstChord, formAsPlayed, lastPassBars, secondsFor, type TopAnalysis } from "./as-played";
export { endingLabel, endingPassesOf, playsOnPass, type RepeatMarks } from "./endings";
export { generateIntro, suggestIntros, type IntroOptions } from "./intro";
export { CONCERT_READER, prettyMusic, type IntroReader } from "./intro-reader";
export { arrange, performanceBars, transposeChart } from "./perform";
