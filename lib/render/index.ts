export * from "./types";
export { layoutChart, systemHeight, defaultBarsPerLine, defaultZoom } from "./layout";
export { estimateSymbolWidth, splitSymbol, textWidth, STAFF_SPACE, STAFF_HEIGHT, SUPERSCRIPT_SCALE } from "./metrics";
export { viewSequence, step, viewPage, viewLabel, indexOfPage, type View } from "./early-turn";
export { partLabel, clefFor } from "./part-label";
export { keyFifths, keyAccidentalCount } from "./keys";
