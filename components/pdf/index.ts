// PDF and image parts for the stand. The bandstand can embed PartViewer (with its controls for
// page turns) or send the reader to PartScreen.
export { PartViewer, type PartViewerControls, type PartViewerProps } from "./PartViewer";
export { PartScreen, type PartScreenProps } from "./PartScreen";
export { PartOnStand, type PartOnStandProps } from "./PartOnStand";
