// The bandstand pieces for other screens (playing through a set, reading a PDF part).
export { Bandstand, type BandstandProps, type BandstandTune } from "./Bandstand";
export { PageFlipper } from "./flipper";
export { usePedalKeys } from "./usePedalKeys";
export { useWakeLock } from "./useWakeLock";
export { useReadingSettings, saveReadingSettings, DEFAULT_SETTINGS, THEMES, type Theme, type ReadingSettings } from "./settings";
