// How a chord symbol splits for drawing: the same split the layout measured.
export { displayParts as chordParts } from "@/lib/render/metrics";
