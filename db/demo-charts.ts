// The demo band's book: original tunes written for the Pedalpoint demo, with invented titles and
// composers. Written in the chart text format (docs/chart-text.md). Progressions are our own.

export interface DemoChart {
  slug: string;
  /** What this tune is in the demo for (forms, keys and meters the demo must cover). */
  covers: string[];
  text: string;
}

export const DEMO_CHARTS: DemoChart[] = [
  {
    slug: "lanternfish",
    covers: ["AABA", "major", "4/4", "composed intro", "Bb7sus4 in concert Eb"],
    text: `title: Lanternfish
composer: Odile Marchbank
key: Eb
time: 4/4
tempo: 152
feel: medium swing

Intro:
| Bb7sus4 | Bb7sus4 | Bb7sus4 | Bb7(b9) |
A:
|: Ebmaj7 | Dbmaj7 | Ebmaj7 | Cm7 F7 |
| Fm7 | Gb7 | [1 Ebmaj7 Abmaj7 | Fm7 Bb7 :| [2 Ebmaj7 | % |
B:
| Am7b5 | D7(b9) | Gm7 | C7 |
| Fm7 | Ab7 | Gm7 C7 | Fm7 Bb7 |
A:
| Ebmaj7 | Dbmaj7 | Ebmaj7 | Cm7 F7 |
| Fm7 | Gb7 | Ebmaj7 | Fm7 Bb7 |
`,
  },
  {
    slug: "tidewater-waltz",
    covers: ["ABAC", "major", "3/4"],
    text: `title: Tidewater Waltz
composer: Teodor Vance
key: G
time: 3/4
tempo: 138
feel: jazz waltz

A:
| Gmaj7 | Em9 | Cmaj7 | B7(b9) |
| Em7 | A7 | Am7 | D7 |
B:
| Bm7 | E7 | Am7 | Cm6 |
| Gmaj7 / E7 | Am7 / D7 | Bm7 Bbdim7 Am7 | D7sus4 |
A:
| Gmaj7 | Em9 | Cmaj7 | B7(b9) |
| Em7 | A7 | Am7 | D7 |
C:
| Cmaj7 | Cm6 | Bm7 | E7(b9) |
| Am7 | D7 | G6 | Am7 / D7 |
`,
  },
  {
    slug: "gull-on-the-rail",
    covers: ["12-bar blues", "major", "4/4"],
    text: `title: Gull on the Rail
composer: Priya Halloran
key: F
time: 4/4
tempo: 126
feel: medium blues

A:
|: F7 | Bb7 | F7 | Cm7 F7 |
| Bb7 | Bdim7 | F7 | D7(b9) |
| Gm7 | C7 | F7 D7 | Gm7 C7 :|
`,
  },
  {
    slug: "coal-barge",
    covers: ["minor blues", "minor", "4/4"],
    text: `title: Coal Barge
composer: Mabel Okonjo
key: Cm
time: 4/4
tempo: 116
feel: slow grind

A:
|: Cm7 | Cm7 | Cm7 | C7(#9) |
| Fm7 | Fm7 | Cm7 | Cm7 |
| Abmaj7 | G7(#9) | Cm7 Eb7 | Dm7b5 G7(b9) :|
`,
  },
  {
    slug: "weatherglass",
    covers: ["starts away from the tonic", "major", "4/4"],
    text: `title: Weatherglass
composer: Teodor Vance
key: Bb
time: 4/4
tempo: 132
feel: bossa

A:
| Gbmaj7 | Fm7 Bb7 | Ebmaj7 | Ab7(#11) |
| Dm7 | G7(b9) | Cm7 | F7sus4 |
B:
| Bbmaj7 | % | Em7b5 | A7(b9) |
| Dm7 | Db7 | Cm7 | F7 |
`,
  },
  {
    slug: "crooked-signal",
    covers: ["AABA", "major", "4/4", "composed intro"],
    text: `title: Crooked Signal
composer: Odile Marchbank
key: Ab
time: 4/4
tempo: 212
feel: up swing

Intro:
| Fm7 | E7(#11) | Ebm7 | D7(#11) |
| Dbmaj7 | C7(#9) | Bbm7 | Eb7sus4 Eb7 |
A:
|: Abmaj7 | Bbm7 Eb7 | Abmaj7 | Cm7 F7 |
| Bbm7 | Db7 | [1 Cm7 Bdim7 | Bbm7 Eb7 :| [2 Abmaj7 | % |
B:
| Gbmaj7 | Fm7 | Em7 A7 | Dmaj7 |
| Dbm7 Gb7 | Bmaj7 | Bbm7 | Eb7(b9) |
A:
| Abmaj7 | Bbm7 Eb7 | Abmaj7 | Cm7 F7 |
| Bbm7 | Db7 | Abmaj7 | Bbm7 Eb7 |
`,
  },
  {
    slug: "driftwood-ledger",
    covers: ["minor", "4/4"],
    text: `title: Driftwood Ledger
composer: Gus Ferreira-Lind
key: Dm
time: 4/4
tempo: 168
feel: medium swing

A:
|: Dm7 | Em7b5 A7(b9) | Dm7 | Bb7(#11) |
| Gm7 | C7 | Fmaj7 | Em7b5 A7(b9) :|
B:
| Bbmaj7 | Am7 | Gm7 | Fmaj7 |
| Em7b5 | A7(b9) | Dm7 | Em7b5 A7 |
`,
  },
  {
    slug: "oarlock-round",
    covers: ["minor", "3/4"],
    text: `title: Oarlock Round
composer: Ines Delacroix-Moore
key: Em
time: 3/4
tempo: 150
feel: jazz waltz

A:
| Em | Em(maj7) | Em7 | Em6 |
| Am7 | D7 | Gmaj7 | Cmaj7 |
| F#m7b5 | B7(b9) | Em | % |
B:
| Am7 | D7 | Gmaj7 | Cmaj7 |
| F#m7b5 | B7 | Em | B7sus4 / B7 |
`,
  },
  {
    slug: "slow-tide-at-fennick-quay",
    covers: ["AABA", "major", "4/4", "ballad"],
    text: `title: Slow Tide at Fennick Quay
composer: Teodor Vance
key: Db
time: 4/4
tempo: 60
feel: ballad

A:
|: Dbmaj7 | Gbmaj7 | Fm7 | Bbm7 |
| Ebm7 | Ab7 | [1 Dbmaj7 Bbm7 | Ebm7 Ab7 :| [2 Dbmaj7 | Cm7b5 F7(b9) |
B:
| Bbm7 | Bbm7/Ab | Gm7b5 | C7(b9) |
| Fm7 | Bb7 | Ebm7 | Ab7sus4 Ab7 |
A:
| Dbmaj7 | Gbmaj7 | Fm7 | Bbm7 |
| Ebm7 | Ab7 | Dbmaj7 | % |
`,
  },
  {
    slug: "glasshouse-samba",
    covers: ["ABAC", "minor", "4/4"],
    text: `title: Glasshouse Samba
composer: Rafe Castellan
key: Am
time: 4/4
tempo: 184
feel: samba

A:
| Am9 | % | Bm7b5 | E7(b9) |
| Am9 | Gm7 C7 | Fmaj7 | Bm7b5 E7 |
B:
| Cmaj7 | Fmaj7 | Dm7 | G7 |
| Em7 | A7(b9) | Dm7 | E7sus4 E7 |
A:
| Am9 | % | Bm7b5 | E7(b9) |
| Am9 | Gm7 C7 | Fmaj7 | Bm7b5 E7 |
C:
| Fmaj7 | Fm6 | Em7 | A7 |
| Dm7 | E7(b9) | Am6 | % |
`,
  },
  {
    slug: "semaphore-hop",
    covers: ["AABA", "major", "4/4"],
    text: `title: Semaphore Hop
composer: Jonah Pike
key: F
time: 4/4
tempo: 240
feel: up swing

A:
|: F6 | Eb7 | F6 | Ab7 |
| Gm7 | C7 | [1 F6 | Gm7 C7 :| [2 F6 | % |
B:
| Am7b5 | D7 | Gm7 | % |
| Bbm7 | Eb7 | Am7 D7 | Gm7 C7 |
A:
| F6 | Eb7 | F6 | Ab7 |
| Gm7 | C7 | F6 | Gm7 C7 |
`,
  },
  {
    slug: "low-fog-over-carrow-point",
    covers: ["minor", "4/4", "modal"],
    text: `title: Low Fog over Carrow Point
composer: Odile Marchbank
key: Dm
time: 4/4
tempo: 100
feel: straight eighths

A:
|: Dm9 | % | Fmaj7 | % |
| Gm9 | % | Bbmaj7 | A7sus4 :|
B:
| Cmaj7 | % | Bbmaj7(#11) | % |
| Am7 | % | Gm7 | A7(b9) |
`,
  },
  {
    slug: "morning-at-the-ropewalk",
    covers: ["major", "3/4"],
    text: `title: Morning at the Ropewalk
composer: Priya Halloran
key: Bb
time: 3/4
tempo: 176
feel: jazz waltz

A:
| Bbmaj7 | Cm7 | Dm7 | Ebmaj7 |
| Cm7 | F7 | Dm7 / G7 | Cm7 / F7 |
B:
| Ebmaj7 | Ebm6 | Dm7 | G7(b9) |
| Cm7 | F7sus4 | Bbmaj7 | % |
`,
  },
];
