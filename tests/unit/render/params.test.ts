import { describe, expect, it } from "vitest";
import { chartQuery, parseReadingChoices } from "@/components/chart/params";

const read = (q: string) => parseReadingChoices(new URLSearchParams(q));

describe("chart address parameters", () => {
  it("reads the part, a singer's key and an intro with its options", () => {
    // The vamp's two chords are split on a space: symbols such as C7(b9,#11) hold commas.
    expect(read("instrument=bb&key=F&intro=vamp&introBars=4&introRepeats=2&vamp=Cm7+F7(b9,%2311)")).toEqual({
      instrument: "bb",
      key: "F",
      tempo: null,
      intro: { kind: "vamp", bars: 4, repeats: 2, vamp: ["Cm7", "F7(b9,#11)"] },
      tag: null,
    });
  });

  it("falls back to the defaults for anything it cannot read", () => {
    expect(read("instrument=kazoo&key=H&intro=fanfare&tempo=fast")).toEqual({ instrument: null, key: null, tempo: null, intro: undefined, tag: null });
    // A tempo outside what a band plays (or not a whole number) is not a tempo.
    expect(read("tempo=0").tempo).toBeNull();
    expect(read("tempo=9000").tempo).toBeNull();
    expect(read("tempo=120.5").tempo).toBeNull();
  });

  it("tells 'no intro' apart from 'the chart's own default'", () => {
    expect(read("intro=none").intro).toBeNull();
    expect(read("").intro).toBeUndefined();
  });

  it("writes back what it reads", () => {
    const q = chartQuery({ instrument: "eb", key: "Db", intro: { kind: "turnaround", variant: "iii-VI-ii-V", tritoneSub: true } });
    expect(read(q.slice(1))).toEqual({ instrument: "eb", key: "Db", tempo: null, intro: { kind: "turnaround", variant: "iii-VI-ii-V", tritoneSub: true }, tag: null });
    expect(chartQuery({ intro: null })).toBe("?intro=none");
  });

  it("carries a set list's tempo next to the key and the intro", () => {
    const q = chartQuery({ instrument: "bb", key: "F", tempo: 132, intro: { kind: "vamp" } });
    expect(new URLSearchParams(q.slice(1)).get("tempo")).toBe("132");
    expect(read(q.slice(1))).toEqual({ instrument: "bb", key: "F", tempo: 132, intro: { kind: "vamp" }, tag: null });
    expect(chartQuery({ tempo: null })).toBe("");
  });

  it("item 3: carries a set list's tag ending (?tag=4x3) and refuses one out of range", () => {
    const q = chartQuery({ instrument: "bb", tag: { bars: 4, times: 3 } });
    expect(new URLSearchParams(q.slice(1)).get("tag")).toBe("4x3");
    expect(read(q.slice(1)).tag).toEqual({ bars: 4, times: 3 });
    expect(read("tag=0x3").tag).toBeNull();
    expect(read("tag=4x99").tag).toBeNull();
    expect(read("tag=four").tag).toBeNull();
  });
});
