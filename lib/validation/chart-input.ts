// The body of a chart create/update, shared by the chart form and the route handlers.
import { z } from "zod";

export const KEY_PATTERN = /^[A-G](#|b)?m?$/;
export const METER_PATTERN = /^(\d{1,2})\/(2|4|8)$/;

export const ChartInputSchema = z
  .object({
    title: z.string().trim().min(1, "A chart needs a title").max(200),
    composer: z.string().trim().max(200).default(""),
    key: z.string().trim().regex(KEY_PATTERN, "Use a concert key like Eb, F#, Bb or Cm"),
    meter: z.string().trim().regex(METER_PATTERN, "Use a time signature like 4/4 or 3/4"),
    tempo: z.number().int().min(20).max(400).nullable().default(null),
    feel: z.string().trim().max(60).default(""),
    sourceText: z.string().max(50_000, "The chart text is too long (50,000 characters at most)"),
    message: z.string().trim().max(200).default(""),
  })
  .strict();
export type ChartInput = z.infer<typeof ChartInputSchema>;

export const ChartCreateSchema = ChartInputSchema.extend({ id: z.uuid().optional() }).strict();
export type ChartCreate = z.infer<typeof ChartCreateSchema>;

export const ChartUpdateSchema = ChartInputSchema.extend({ baseRevision: z.number().int().min(1) }).strict();
export type ChartUpdate = z.infer<typeof ChartUpdateSchema>;
