// Pedalpoint's rhythm section on paper: an arrangement's bars → timed piano, bass and drum events.
// Pure: no audio here (components/player plays the events).
export * from "./types";
export { generateAccompaniment, finalChordSymbol, COUNT_IN_BARS, RITARDANDO_END } from "./generate";
export { playedBars, playedSections, VAMP_OUT_TIMES, type PlayedSection } from "./as-played";
export { feelOf, swingRatio, swungBeat } from "./feel";
export { voiceChord, rootlessSlots, shellSlots, motion, VOICING_LOW, VOICING_HIGH, type Voicing, type Position } from "./voicing";
export { BASS_LOW, BASS_HIGH } from "./bass";
export { backBeats } from "./drums";
