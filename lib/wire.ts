// One wire shape per entity: what the route handlers answer, the sync feed carries and the device
// stores (device rows are `Wire… & { local fields }`, lib/offline/types.ts). Pure zod schemas.
import { z } from "zod";
import { ChartSchema } from "@/lib/chart/model";
import { RoleSchema } from "@/lib/band/roles";
import { MarkDataSchema, SetlistEntrySchema } from "@/lib/setlist";

const Id = z.string().min(1).max(64);
const Stamp = z.string();

/** Composer, key, meter, tempo and feel as they stood at a revision (stored by the backend as meta_json). */
export const RevisionMetaSchema = z.record(z.string(), z.unknown());
export type RevisionMeta = z.infer<typeof RevisionMetaSchema>;

export const WireRevisionSchema = z.object({
  revision: z.number().int(),
  title: z.string(),
  message: z.string(),
  authorName: z.string(),
  createdAt: Stamp,
  /** Null for the chart's current revision: its text is the chart's own `sourceText` (sent once). */
  sourceText: z.string().nullable(),
  meta: RevisionMetaSchema,
});
export type WireRevision = z.infer<typeof WireRevisionSchema>;

export const WireChartSchema = z.object({
  id: Id,
  bandId: Id,
  title: z.string(),
  composer: z.string(),
  /** The chart's concert key ("Eb", "Cm"). */
  key: z.string(),
  meter: z.string(),
  tempo: z.number().nullable(),
  feel: z.string(),
  sourceText: z.string(),
  body: ChartSchema,
  revision: z.number().int(),
  updatedBy: z.object({ id: z.string(), name: z.string() }),
  updatedAt: Stamp,
  deletedAt: Stamp.nullable(),
  /** The latest revisions, newest first: the sync feed sends them (the history list), the routes leave them out. */
  history: z.array(WireRevisionSchema).optional(),
});
export type WireChart = z.infer<typeof WireChartSchema>;

/** One tune on a set list as stored: the editor's entry with the list it belongs to. */
export const WireSetlistEntrySchema = SetlistEntrySchema.extend({ setlistId: Id });
export type WireSetlistEntry = z.infer<typeof WireSetlistEntrySchema>;

export const WireSetlistSchema = z.object({
  id: Id,
  bandId: Id,
  name: z.string(),
  startsAt: Stamp.nullable(),
  venue: z.string(),
  notes: z.string(),
  /** The leader's length for each set in minutes (index 0 = set 1). */
  setMinutes: z.array(z.number().nullable()),
  revision: z.number().int(),
  updatedBy: z.string(),
  updatedAt: Stamp,
  entries: z.array(WireSetlistEntrySchema),
});
export type WireSetlist = z.infer<typeof WireSetlistSchema>;

/** A player's own mark on a bar (the sync feed's "annotation" entity). */
export const WireMarkSchema = z.object({
  id: Id,
  chartId: Id,
  revision: z.number().int(),
  updatedAt: Stamp,
  data: MarkDataSchema,
});
export type WireMark = z.infer<typeof WireMarkSchema>;

/** A part (PDF or image) uploaded for a chart (the sync feed's "attachment" entity). */
export const WirePartSchema = z.object({
  id: Id,
  chartId: Id,
  filename: z.string(),
  sha256: z.string(),
  size: z.number().int(),
  type: z.string(),
  pages: z.number().int().nullable(),
  createdAt: Stamp,
  /** The part's name and instrument id (null on parts uploaded before they were asked). */
  partName: z.string().nullable(),
  instrument: z.string().nullable(),
});
export type WirePart = z.infer<typeof WirePartSchema>;

/** Someone on the band's roster. */
export const WireMemberSchema = z.object({
  userId: Id,
  name: z.string(),
  email: z.string(),
  role: RoleSchema,
  instrument: z.string(),
  expiresAt: Stamp.nullable(),
});
export type WireMember = z.infer<typeof WireMemberSchema>;

/** The caller's own place in a band. */
export const WireMembershipSchema = z.object({
  bandId: Id,
  role: RoleSchema,
  instrument: z.string(),
  expiresAt: Stamp.nullable(),
});
export type WireMembership = z.infer<typeof WireMembershipSchema>;
