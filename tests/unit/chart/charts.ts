// Small charts written for these tests (generic progressions, not tunes).
import { parseChartText } from "@/lib/chart";

/** Major, starts on its tonic, last bar on the tonic. */
export const ON_TONIC = parseChartText(`title: Test in F
key: F
A:
| Fmaj7 | Dm7 | Gm7 | C7 |
| Am7 D7 | Gm7 C7 | Fmaj7 | Fmaj7 |
B:
| Cm7 | F7 | Bbmaj7 | Bbmaj7 |
| Gm7 | C7 | Fmaj7 | Fmaj7 |
`);

/** Starts on ii of the key, away from the tonic; its last bar is already the V of bar 1's chord. */
export const AWAY = parseChartText(`title: Test on ii
key: Bb
A:
| Cm7 | F7 | Bbmaj7 | Ebmaj7 |
| Am7b5 | D7(b9) | Gm7 | G7 |
`);

/** Minor, with a repeat and endings. */
export const MINOR = parseChartText(`title: Test in D minor
key: Dm
time: 4/4
A:
|: Dm7 | Em7b5 A7(b9) | Dm7 | Gm7 |
| [1 Bbmaj7 | A7 :| [2 Em7b5 A7(b9) | Dm7 |
`);

/** A composed intro, in 3/4. */
export const WITH_INTRO = parseChartText(`title: Test with intro
key: G
time: 3/4
Intro:
| Cmaj7 | Bm7 | Am7 | D7 |
A:
| Gmaj7 | Em7 | Am7 | D7 |
`);

/** A blues: the tonic is I7. */
export const BLUES = parseChartText(`title: Test blues
key: F
A:
| F7 | Bb7 | F7 | F7 |
| Bb7 | Bb7 | F7 | D7 |
| Gm7 | C7 | F7 | C7 |
`);

/** Short form, with a melody. */
export const SHORT = parseChartText(`title: Test short
key: Eb
A:
| Ebmaj7 | Ab7 |
melody: | G4:w | Ab4:h C5:h |
`);
