// Tonight's gig for the demo: two sets at the band's usual room, dated from the day the demo starts,
// and a live share of it with the demo sub. Invented like the rest of the demo.
import type { IntroChoice } from "@/lib/chart/model";
import type { EndingChoice } from "@/lib/setlist/model";

export interface DemoTune {
  slug: string;
  /** Tonight's concert key (a singer's key), or null for the chart's own. */
  key?: string;
  tempo?: number;
  intro?: IntroChoice;
  straightIn?: boolean;
  ending?: EndingChoice;
  soloOrder: string;
  choruses?: number;
  notes?: string;
}

export const DEMO_GIG: { name: string; notes: string; setMinutes: number[]; sets: DemoTune[][] } = {
  name: "Tonight at The Lanternfish Room",
  notes: "Downbeat 8:30. Load in through the alley door by 7:45; dark clothes. Ines sings Tidewater Waltz and Slow Tide.",
  /** The leader's length for each set, in minutes. */
  setMinutes: [45, 45],
  sets: [
    [
      { slug: "crooked-signal", soloOrder: "trumpet, alto, piano", notes: "Count it fast; the written intro sets the tempo." },
      { slug: "tidewater-waltz", key: "F", intro: { kind: "turnaround", variant: "I-vi-ii-V", bars: 4 }, soloOrder: "piano" },
      { slug: "coal-barge", intro: { kind: "vamp", bars: 4, repeats: 2 }, ending: { kind: "cold" }, soloOrder: "trombone, bass" },
      { slug: "slow-tide-at-fennick-quay", key: "Eb", intro: { kind: "last-bars", bars: 4 }, ending: { kind: "ritardando", bars: 2 }, soloOrder: "" },
      { slug: "weatherglass", intro: { kind: "two-five" }, soloOrder: "alto, trumpet" },
      {
        slug: "semaphore-hop",
        intro: { kind: "dominant-pedal", bars: 4 },
        ending: { kind: "tag", bars: 4, times: 3 },
        soloOrder: "trumpet, alto, trombone, piano",
        notes: "Drums trade fours with the horns before the last head.",
      },
    ],
    [
      { slug: "lanternfish", soloOrder: "tenor, piano", notes: "Jonah takes the first solo." },
      { slug: "oarlock-round", intro: { kind: "solo-chorus" }, soloOrder: "piano, bass" },
      { slug: "low-fog-over-carrow-point", intro: { kind: "vamp", bars: 8 }, soloOrder: "tenor, trombone" },
      { slug: "gull-on-the-rail", intro: { kind: "last-bars", bars: 4 }, soloOrder: "alto, tenor, trumpet", choruses: 2 },
      { slug: "glasshouse-samba", intro: { kind: "dominant-pedal", bars: 8 }, ending: { kind: "vamp-out", bars: 2 }, soloOrder: "piano, drums" },
      { slug: "morning-at-the-ropewalk", straightIn: true, ending: { kind: "cold" }, soloOrder: "trumpet" },
    ],
  ],
};

/** Tonight at 20:30 UTC on the day the demo starts (tomorrow's, once tonight's has been over for hours). */
export function demoGigStart(now: Date): Date {
  const start = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), 20, 30));
  if (now.getTime() - start.getTime() > 4 * 3_600_000) start.setUTCDate(start.getUTCDate() + 1);
  return start;
}

/** The sub's share runs to 06:00 the morning after the gig. */
export function demoShareEnd(start: Date): Date {
  return new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth(), start.getUTCDate() + 1, 6, 0));
}
