// A chart that crowds a page on purpose: four chords a bar, endings, a long title.
export const CROWDED_TITLE = "The Harbourmaster's Extraordinarily Long Lament for the Seventh Lantern of Port Wren";
export const CROWDED_TEXT = `A:
|: Dm7 G7 Em7 A7 | Dm7 G7 Cmaj7 C7 | Fmaj7 Fm7 Em7 Ebdim7 | Dm7 G7(b9) Cmaj7 A7(#5) |
| Dm7 | G7 | [1 Cmaj7 Am7 | Dm7 G7 :| [2 Cmaj7 | % |
B:
| Ebm7 Ab7 Dbmaj7 Bbm7 | Ebm7 Ab7 Dbmaj7 Gm7b5 | Cm7 F7 Bbmaj7 Eb7 | Dm7 G7 C6 Am7 |
`;
