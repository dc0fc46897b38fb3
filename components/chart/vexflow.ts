// VexFlow for the engraving, in one place: the core build (no fonts bundled as data URLs), told to
// draw with our music font and Academico (music-fonts.ts loads both as files). Every drawing module
// imports VexFlow from here, never from "vexflow" or "vexflow/bravura" (checked by
// tests/unit/perf/bundle-guard.test.ts), so no page ships the fonts inside a script again.
import { VexFlow } from "vexflow/core";
import { MUSIC_FONT, TEXT_FONT_FAMILY } from "./music-fonts";

VexFlow.setFonts(MUSIC_FONT, TEXT_FONT_FAMILY);

export * from "vexflow/core";
