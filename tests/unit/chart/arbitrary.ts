// fast-check generators of chart models the text format can say.
import fc from "fast-check";
import type { Bar, Chart, MelodyNote, Meter, Section } from "@/lib/chart";

const METERS: Meter[] = [{ beats: 4, unit: 4 }, { beats: 3, unit: 4 }, { beats: 6, unit: 8 }, { beats: 2, unit: 2 }, { beats: 5, unit: 4 }, { beats: 12, unit: 8 }];
const KEYS = ["C", "Eb", "F#", "Bb", "Db", "Am", "Cm", "F#m", "Bbm"];
const SYMBOLS = ["Cmaj7", "Dm7", "G7", "Bb7(b9)", "F#m7b5", "Ebmaj7(#11)", "N.C.", "Ab13(b9)", "Cm(maj7)", "E7alt", "Db6/9", "Bb/D", "Gsus4", "C+", "Bdim7", "A7(#9,b13)"];
const PITCHES = [null, "C4", "Eb4", "F#4", "G4", "Bb4", "C5", "D5"];

const WORDS = ["Harbor", "lights", "No", "7", "O'Dell", "slow", "Blue", "mist", "Rain", "at", "two", "K"];
/** A few words, starting with a capital or a lower-case letter as asked. */
const words = (first: string) =>
  fc.array(fc.constantFrom(...WORDS), { minLength: 1, maxLength: 4 }).map((ws) => {
    const text = ws.join(" ");
    return first === "[A-Z]" ? `T${text}` : `t${text}`;
  });

function divisors(n: number): number[] {
  return Array.from({ length: n }, (_, i) => i + 1).filter((d) => n % d === 0);
}

/** Chords of one bar the way the text can say them: n tokens sharing the beats, each a chord or a "/". */
const barChords = (meter: Meter) =>
  fc.constantFrom(...divisors(meter.beats)).chain((n) =>
    fc.tuple(fc.constantFrom(...SYMBOLS), fc.array(fc.option(fc.constantFrom(...SYMBOLS), { nil: null }), { minLength: n - 1, maxLength: n - 1 })).map(([first, rest]) => {
      const each = meter.beats / n;
      const chords = [{ symbol: first, beat: 0, beats: each }];
      rest.forEach((s, i) => {
        if (s === null) chords[chords.length - 1]!.beats += each;
        else chords.push({ symbol: s, beat: (i + 1) * each, beats: each });
      });
      return chords;
    }),
  );

/** A melody filling the bar exactly, from whole notes down to eighths. */
const melody = (meter: Meter) => {
  const total = (meter.beats * 4) / meter.unit;
  return fc.array(fc.tuple(fc.constantFrom(...PITCHES), fc.constantFrom<MelodyNote["duration"]>("h", "q", "8"), fc.boolean()), { minLength: 1, maxLength: 12 }).map((picks) => {
    const out: MelodyNote[] = [];
    let left = total;
    for (const [pitch, duration, tie] of picks) {
      const len = { h: 2, q: 1, "8": 0.5 }[duration as "h" | "q" | "8"];
      if (len > left) continue;
      out.push({ pitch, duration, dots: 0, tie: tie && pitch !== null });
      left -= len;
    }
    while (left >= 1) {
      out.push({ pitch: null, duration: "q", dots: 0, tie: false });
      left -= 1;
    }
    if (left > 0) out.push({ pitch: null, duration: "8", dots: 0, tie: false });
    return out;
  });
};

const bar = (meter: Meter, opts: { simileOk: boolean }) =>
  fc.record({
    chords: barChords(meter),
    simile: opts.simileOk ? fc.boolean() : fc.constant(false),
    melody: fc.option(melody(meter), { nil: undefined, freq: 4 }),
  }).map(({ chords, simile, melody: m }): Bar => {
    const b: Bar = { chords: simile ? [] : chords, simile, repeatStart: false, repeatEnd: false, ending: null };
    if (m) b.melody = m;
    return b;
  });

const section = (meter: Meter, label: fc.Arbitrary<string>) =>
  fc
    .record({
      label,
      body: fc.array(bar(meter, { simileOk: true }), { minLength: 1, maxLength: 9 }),
      repeat: fc.constantFrom("none", "plain", "times", "endings", "shared-ending"),
      times: fc.integer({ min: 3, max: 6 }),
      first: fc.array(bar(meter, { simileOk: true }), { minLength: 1, maxLength: 3 }),
      second: fc.array(bar(meter, { simileOk: true }), { minLength: 1, maxLength: 3 }),
    })
    .map(({ label: l, body, repeat, times, first, second }): Section => {
      const bars = body.map((b) => ({ ...b }));
      bars[0] = { ...bars[0]!, simile: false, chords: bars[0]!.simile ? [{ symbol: "C", beat: 0, beats: meter.beats }] : bars[0]!.chords };
      if (repeat !== "none") bars[0]!.repeatStart = true;
      if (repeat === "plain" || repeat === "times") {
        const last = bars[bars.length - 1]!;
        last.repeatEnd = true;
        if (repeat === "times") last.repeatTimes = times;
      }
      if (repeat === "endings") {
        first.forEach((b, i) => bars.push({ ...b, ending: 1, repeatEnd: i === first.length - 1 }));
        second.forEach((b) => bars.push({ ...b, ending: 2 }));
      }
      if (repeat === "shared-ending") {
        // three times through: one ending for passes 1 and 2, another for pass 3
        first.forEach((b, i) => bars.push({ ...b, ending: 1, endingPasses: [1, 2], repeatEnd: i === first.length - 1, ...(i === first.length - 1 ? { repeatTimes: 3 } : {}) }));
        second.forEach((b) => bars.push({ ...b, ending: 3 }));
      }
      return { label: l, bars };
    });

export const chartArb: fc.Arbitrary<Chart> = fc.constantFrom(...METERS).chain((meter) =>
  fc.record({
    title: words("[A-Z]"),
    composer: fc.oneof(fc.constant(""), words("[A-Z]")),
    key: fc.constantFrom(...KEYS),
    meter: fc.constant(meter),
    tempo: fc.option(fc.integer({ min: 20, max: 400 }), { nil: null }),
    feel: fc.oneof(fc.constant(""), words("[a-z]")),
    intro: fc.option(section(meter, fc.constant("Intro")), { nil: null }),
    sections: fc.array(section(meter, fc.constantFrom("A", "B", "C", "Bridge", "Coda", "Vamp out", "A2")), { minLength: 1, maxLength: 4 }),
  }),
);
