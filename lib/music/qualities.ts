// The chord qualities Pedalpoint reads, in house style, with the spellings charts use for them.
// Intervals follow tonal's names; the 11th and 13th chords take the jazz reading (C11 without the
// 3rd, C13 without the 11th), which is also tonal's. MusicXML <kind> values are given for each.

export interface Quality {
  /** House-style suffix, ASCII: "", "m7", "maj7", "7sus4", "m7b5", "dim7"… */
  id: string;
  intervals: string[];
  /** The MusicXML 4.0 <kind> value that names this quality (with degrees for the rest). */
  musicxmlKind: string;
  /** Triad family, for analysis: the case of a roman numeral and the quality mark on the baseline. */
  family: "major" | "minor" | "diminished" | "half-diminished" | "augmented" | "suspended" | "power";
  /** Has a minor 7th over a major 3rd (or a sus4): the chord acts as a dominant. */
  dominant: boolean;
  /** The degree that names the chord (7, 9, 11, 13; 9 for 6/9), or 0 for triads and sixths; an alteration may not alter it. */
  top: number;
  /** Other spellings charts use for this quality. */
  aliases: string[];
}

const Q = (
  id: string,
  intervals: string,
  musicxmlKind: string,
  family: Quality["family"],
  top: number,
  aliases: string[] = [],
  dominant = false,
): Quality => ({ id, intervals: intervals.split(" "), musicxmlKind, family, dominant, top, aliases });

export const QUALITIES: Quality[] = [
  Q("", "1P 3M 5P", "major", "major", 0, ["M", "maj", "Maj", "ma"]),
  Q("m", "1P 3m 5P", "minor", "minor", 0, ["min", "mi", "-"]),
  Q("dim", "1P 3m 5d", "diminished", "diminished", 0),
  Q("+", "1P 3M 5A", "augmented", "augmented", 0, ["aug"]),
  Q("sus2", "1P 2M 5P", "suspended-second", "suspended", 0),
  Q("sus4", "1P 4P 5P", "suspended-fourth", "suspended", 0, ["sus"]),
  Q("5", "1P 5P", "power", "power", 0),
  Q("6", "1P 3M 5P 6M", "major-sixth", "major", 0, ["M6", "maj6"]),
  Q("6/9", "1P 3M 5P 6M 9M", "major-sixth", "major", 9, ["69", "6add9", "6(add9)", "M6/9", "M69"]),
  Q("add9", "1P 3M 5P 9M", "major", "major", 0, ["(add9)", "add2", "Madd9"]),
  Q("m6", "1P 3m 5P 6M", "minor-sixth", "minor", 0, ["min6", "mi6", "-6"]),
  Q("m6/9", "1P 3m 5P 6M 9M", "minor-sixth", "minor", 9, ["m69", "min6/9", "-6/9", "-69", "mi6/9"]),
  Q("madd9", "1P 3m 5P 9M", "minor", "minor", 0, ["m(add9)", "-add9", "-(add9)", "minadd9", "miadd9"]),
  Q("maj7", "1P 3M 5P 7M", "major-seventh", "major", 7, ["M7", "Maj7", "MA7", "Ma7", "ma7", "Δ", "Δ7", "^7", "^", "j7"]),
  Q("maj9", "1P 3M 5P 7M 9M", "major-ninth", "major", 9, ["M9", "Maj9", "MA9", "Ma9", "ma9", "Δ9", "^9"]),
  Q("maj13", "1P 3M 5P 7M 9M 13M", "major-13th", "major", 13, ["M13", "Maj13", "MA13", "Ma13", "ma13", "Δ13", "^13"]),
  Q("m7", "1P 3m 5P 7m", "minor-seventh", "minor", 7, ["min7", "mi7", "-7"]),
  Q("m9", "1P 3m 5P 7m 9M", "minor-ninth", "minor", 9, ["min9", "mi9", "-9"]),
  Q("m11", "1P 3m 5P 7m 9M 11P", "minor-11th", "minor", 11, ["min11", "mi11", "-11"]),
  Q("m13", "1P 3m 5P 7m 9M 13M", "minor-13th", "minor", 13, ["min13", "mi13", "-13"]),
  Q("m(maj7)", "1P 3m 5P 7M", "major-minor", "minor", 7, [
    "mmaj7", "mMaj7", "mM7", "m/maj7", "m(M7)", "mΔ", "mΔ7", "-maj7", "-(maj7)", "-Δ", "-Δ7", "minmaj7", "min(maj7)", "-M7", "m^7",
  ]),
  Q("m(maj9)", "1P 3m 5P 7M 9M", "major-minor", "minor", 9, ["mmaj9", "mMaj9", "mM9", "-maj9", "-(maj9)", "-Δ9", "min(maj9)"]),
  Q("7", "1P 3M 5P 7m", "dominant", "major", 7, ["dom7", "dom"], true),
  Q("9", "1P 3M 5P 7m 9M", "dominant-ninth", "major", 9, [], true),
  Q("11", "1P 5P 7m 9M 11P", "dominant-11th", "suspended", 11, [], true),
  Q("13", "1P 3M 5P 7m 9M 13M", "dominant-13th", "major", 13, [], true),
  Q("7sus4", "1P 4P 5P 7m", "suspended-fourth", "suspended", 7, ["7sus"], true),
  Q("9sus4", "1P 4P 5P 7m 9M", "suspended-fourth", "suspended", 9, ["9sus"], true),
  Q("13sus4", "1P 4P 5P 7m 9M 13M", "suspended-fourth", "suspended", 13, ["13sus"], true),
  // Ours (common practice): root, 3rd, ♭7 and all four altered tensions; no natural 5th or 9th.
  Q("7alt", "1P 3M 7m 9m 9A 11A 13m", "dominant", "major", 7, ["alt", "alt7", "7(alt)"], true),
  Q("m7b5", "1P 3m 5d 7m", "half-diminished", "half-diminished", 7, [
    "ø", "ø7", "Ø", "Ø7", "m7(b5)", "min7b5", "mi7b5", "-7b5", "-7(b5)", "min7(b5)", "mi7(b5)",
  ]),
  Q("dim7", "1P 3m 5d 7d", "diminished-seventh", "diminished", 7, ["°", "°7", "o", "o7"]),
];

export const QUALITY_BY_ID: ReadonlyMap<string, Quality> = new Map(QUALITIES.map((q) => [q.id, q]));

/** Every accepted spelling → quality, longest first so that "m7b5" wins over "m7". */
export const QUALITY_SPELLINGS: ReadonlyArray<readonly [string, Quality]> = QUALITIES.flatMap((q) =>
  [q.id, ...q.aliases].map((s) => [s, q] as const),
).sort((a, b) => b[0].length - a[0].length);
