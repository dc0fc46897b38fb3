// Set lists for a gig: the tunes in each set and how each one is played tonight.
// One zod schema per shape, shared by the gig editor, the route handlers, sync and Dexie. Pure.
import { z } from "zod";
import { IntroChoiceSchema } from "@/lib/chart/model";
import { IdSchema, IsoDateTimeSchema } from "@/lib/validation/common";
import { KEY_PATTERN } from "@/lib/validation/chart-input";

export const MAX_SETS = 6;
export const MAX_ENTRIES = 120;
export const MAX_CHORUSES = 16;
/** The longest set a leader can ask for, in minutes. */
export const MAX_SET_MINUTES = 240;

/** The length the leader wants for each set, in minutes: index 0 = set 1; null = not set. */
export const SetMinutesSchema = z
  .array(
    z
      .number()
      .int("Give the set length in whole minutes")
      .min(5, "A set runs at least 5 minutes")
      .max(MAX_SET_MINUTES, `A set runs at most ${MAX_SET_MINUTES} minutes`)
      .nullable(),
  )
  .max(MAX_SETS)
  .default([]);

export const ENDING_KINDS = ["as-written", "tag", "ritardando", "cold", "vamp-out"] as const;
export const EndingKindSchema = z.enum(ENDING_KINDS, {
  message: "Choose an ending: as-written, tag, ritardando, cold or vamp-out",
});
export type EndingKind = z.infer<typeof EndingKindSchema>;

/** How a tune ends tonight (trade practice). */
export const EndingChoiceSchema = z.discriminatedUnion("kind", [
  /** The chart's own ending, as written. */
  z.object({ kind: z.literal("as-written") }).strict(),
  /** Play the last `bars` bars `times` more times before the final chord. */
  z
    .object({
      kind: z.literal("tag"),
      bars: z.number().int().min(1, "Tag at least one bar").max(16, "Tag at most 16 bars"),
      times: z.number().int().min(1, "Tag at least once").max(8, "Tag at most 8 times"),
    })
    .strict(),
  /** Slow down over the last bars. */
  z.object({ kind: z.literal("ritardando"), bars: z.number().int().min(1).max(8).default(2) }).strict(),
  /** Stop together on the last chord, no hold. */
  z.object({ kind: z.literal("cold") }).strict(),
  /** Vamp the last two bars until the leader cues the end. */
  z.object({ kind: z.literal("vamp-out"), bars: z.number().int().min(1).max(8).default(2) }).strict(),
]);
export type EndingChoice = z.infer<typeof EndingChoiceSchema>;

export const ConcertKeySchema = z.string().trim().regex(KEY_PATTERN, "Use a concert key like Eb, F#, Bb or Cm");

/** One tune on the set list with tonight's arrangement. Null key/tempo/intro/ending = the chart's own. */
export const SetlistEntrySchema = z
  .object({
    id: z.uuid({ message: "Not a valid entry id" }),
    chartId: IdSchema,
    setNumber: z.number().int().min(1).max(MAX_SETS, `A gig has at most ${MAX_SETS} sets`),
    position: z.number().int().min(0).max(MAX_ENTRIES),
    key: ConcertKeySchema.nullable().default(null),
    tempo: z.number().int().min(20, "Tempo must be at least 20").max(400, "Tempo must be at most 400").nullable().default(null),
    intro: IntroChoiceSchema.nullable().default(null),
    /** No intro tonight, straight in at the top, even where the chart has its own (then `intro` is null). */
    straightIn: z.boolean().default(false),
    ending: EndingChoiceSchema.nullable().default(null),
    /** Who solos, in order: "tenor, piano, bass". */
    soloOrder: z.string().trim().max(200, "Keep the solo order under 200 characters").default(""),
    /** Choruses each soloist takes (for the set's running time). */
    choruses: z.number().int().min(1, "At least one chorus each").max(MAX_CHORUSES, `At most ${MAX_CHORUSES} choruses each`).default(1),
    notes: z.string().trim().max(500, "Keep the note under 500 characters").default(""),
  })
  // Not strict: devices send back the rows they stored, with setlistId/bandId on them; those are dropped.
  .strip();
export type SetlistEntry = z.infer<typeof SetlistEntrySchema>;
export type SetlistEntryInput = z.input<typeof SetlistEntrySchema>;

const SetlistFields = {
  name: z.string().trim().min(1, "A set list needs a name").max(120, "Keep the name under 120 characters"),
  startsAt: IsoDateTimeSchema.nullable().default(null),
  venue: z.string().trim().max(160, "Keep the venue under 160 characters").default(""),
  notes: z.string().trim().max(2000, "Keep the notes under 2,000 characters").default(""),
  setMinutes: SetMinutesSchema,
};

function entriesAreConsistent(entries: SetlistEntry[], ctx: z.RefinementCtx): void {
  const ids = new Set<string>();
  entries.forEach((e, i) => {
    if (ids.has(e.id)) ctx.addIssue({ code: "custom", path: ["entries", i, "id"], message: "The same entry appears twice" });
    ids.add(e.id);
  });
}

/** The whole set list as the editor saves it: metadata and every entry (the server replaces the entries). */
export const SetlistInputSchema = z
  .object({
    ...SetlistFields,
    entries: z.array(SetlistEntrySchema).max(MAX_ENTRIES, `A set list has at most ${MAX_ENTRIES} tunes`).default([]),
  })
  .strict()
  .superRefine((v, ctx) => entriesAreConsistent(v.entries, ctx));
export type SetlistInput = z.infer<typeof SetlistInputSchema>;

export const SetlistCreateSchema = z
  .object({ id: z.uuid().optional(), ...SetlistFields, entries: z.array(SetlistEntrySchema).max(MAX_ENTRIES).default([]) })
  .strict()
  .superRefine((v, ctx) => entriesAreConsistent(v.entries, ctx));
export type SetlistCreate = z.infer<typeof SetlistCreateSchema>;

export const SetlistUpdateSchema = z
  .object({
    baseRevision: z.number().int().min(1),
    ...SetlistFields,
    entries: z.array(SetlistEntrySchema).max(MAX_ENTRIES).default([]),
  })
  .strict()
  .superRefine((v, ctx) => entriesAreConsistent(v.entries, ctx));
export type SetlistUpdate = z.infer<typeof SetlistUpdateSchema>;

export const SetlistDuplicateSchema = z
  .object({
    id: z.uuid().optional(),
    name: SetlistFields.name.optional(),
    startsAt: IsoDateTimeSchema.nullable().optional(),
    venue: SetlistFields.venue.optional(),
  })
  .strict();
export type SetlistDuplicate = z.infer<typeof SetlistDuplicateSchema>;

/** Entries grouped by set, each set in play order. Set numbers with no tunes are left out. */
export function groupBySet(entries: readonly SetlistEntry[]): { setNumber: number; entries: SetlistEntry[] }[] {
  const sets = new Map<number, SetlistEntry[]>();
  for (const e of entries) sets.set(e.setNumber, [...(sets.get(e.setNumber) ?? []), e]);
  return [...sets.entries()]
    .sort(([a], [b]) => a - b)
    .map(([setNumber, list]) => ({ setNumber, entries: [...list].sort((a, b) => a.position - b.position) }));
}

/** The whole night in play order: set 1 top to bottom, then set 2 … */
export function playOrder(entries: readonly SetlistEntry[]): SetlistEntry[] {
  return groupBySet(entries).flatMap((s) => s.entries);
}

/** Renumbers positions 0..n-1 inside each set, keeping the given order. */
export function renumber(entries: readonly SetlistEntry[]): SetlistEntry[] {
  const next = new Map<number, number>();
  return entries.map((e) => {
    const p = next.get(e.setNumber) ?? 0;
    next.set(e.setNumber, p + 1);
    return { ...e, position: p };
  });
}
