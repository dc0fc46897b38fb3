// The chart's reading choices as they sit in the address: ?instrument=bb&intro=vamp&introBars=4&key=F&tempo=132.
// Parsed with zod at this boundary; anything unreadable falls back to the default instead of failing.
import { z } from "zod";
import { IntroChoiceSchema, IntroKindSchema, type IntroChoice, type TagEnding } from "@/lib/chart/model";
import { INSTRUMENT_IDS, type InstrumentId } from "@/lib/music/instruments";

export interface ReadingChoices {
  instrument: InstrumentId | null;
  key: string | null;
  /** Tonight's tempo (beats a minute) from a set list; null: the chart's own. */
  tempo: number | null;
  /** undefined: the chart's own default (its composed intro, if any); null: no intro ("none"). */
  intro: IntroChoice | null | undefined;
  /** Tonight's tag ending (?tag=4x3: the last 4 bars three more times); null: none. */
  tag: TagEnding | null;
}

interface ReadableParams {
  get(name: string): string | null;
}

const Instrument = z.enum(INSTRUMENT_IDS);
const Key = z.string().regex(/^[A-G][b#]?m?$/);
const Count = z.coerce.number().int().min(1).max(64);
const Tempo = z.coerce.number().int().min(20).max(400);
const Tag = z
  .string()
  .regex(/^\d{1,2}x\d{1,2}$/)
  .transform((s) => s.split("x").map(Number) as [number, number])
  .refine(([bars, times]) => bars >= 1 && bars <= 16 && times >= 1 && times <= 8)
  .transform(([bars, times]): TagEnding => ({ bars, times }));

function optional<T>(schema: z.ZodType<T>, value: string | null): T | undefined {
  if (value === null || value === "") return undefined;
  const r = schema.safeParse(value);
  return r.success ? r.data : undefined;
}

export function parseReadingChoices(params: ReadableParams): ReadingChoices {
  const kind = optional(IntroKindSchema, params.get("intro"));
  let intro: IntroChoice | null | undefined = params.get("intro") === "none" ? null : undefined;
  if (kind) {
    const vamp = params.get("vamp")?.split(/\s+/).filter(Boolean); // chord symbols hold commas, never spaces
    const candidate = {
      kind,
      bars: optional(Count, params.get("introBars")),
      repeats: optional(Count, params.get("introRepeats")),
      tritoneSub: params.get("tritone") === "1" ? true : undefined,
      variant: optional(z.enum(["I-vi-ii-V", "iii-VI-ii-V"]), params.get("variant")),
      vamp: vamp?.length === 2 ? vamp : undefined,
    };
    const r = IntroChoiceSchema.safeParse(candidate);
    intro = r.success ? r.data : { kind };
  }
  return {
    instrument: optional(Instrument, params.get("instrument")) ?? null,
    key: optional(Key, params.get("key")) ?? null,
    tempo: optional(Tempo, params.get("tempo")) ?? null,
    intro,
    tag: optional(Tag, params.get("tag")) ?? null,
  };
}

/** Query string for a set of choices (only what differs from the chart's own defaults). */
export function chartQuery(p: {
  instrument?: string | null;
  key?: string | null;
  tempo?: number | null;
  intro?: IntroChoice | null;
  tag?: TagEnding | null;
  list?: string | null;
}): string {
  // `intro: null` is written as intro=none; `undefined` leaves the chart's default.
  const q = new URLSearchParams();
  if (p.instrument) q.set("instrument", p.instrument);
  if (p.key) q.set("key", p.key);
  if (p.tempo) q.set("tempo", String(p.tempo));
  if (p.intro === null) q.set("intro", "none");
  if (p.intro) {
    q.set("intro", p.intro.kind);
    if (p.intro.bars) q.set("introBars", String(p.intro.bars));
    if (p.intro.repeats) q.set("introRepeats", String(p.intro.repeats));
    if (p.intro.tritoneSub) q.set("tritone", "1");
    if (p.intro.variant) q.set("variant", p.intro.variant);
    if (p.intro.vamp) q.set("vamp", p.intro.vamp.join(" "));
  }
  if (p.tag) q.set("tag", `${p.tag.bars}x${p.tag.times}`);
  if (p.list) q.set("list", p.list);
  const s = q.toString();
  return s ? `?${s}` : "";
}
