// Every route's address parameters, in one place. Each id keeps the one id character rule (IdSchema).
import { z } from "zod";
import { IdSchema } from "./common";

export const BandParams = z.object({ bandId: IdSchema }).strict();
export const ChartParams = z.object({ bandId: IdSchema, chartId: IdSchema }).strict();
export const RevisionParams = z
  .object({ bandId: IdSchema, chartId: IdSchema, revision: z.coerce.number().int().min(1) })
  .strict();
export const AttachmentParams = z.object({ bandId: IdSchema, chartId: IdSchema, attachmentId: IdSchema }).strict();
export const MemberParams = z.object({ bandId: IdSchema, userId: IdSchema }).strict();
export const SetlistParams = z.object({ bandId: IdSchema, setlistId: IdSchema }).strict();
export const ShareParams = z.object({ bandId: IdSchema, setlistId: IdSchema, shareId: IdSchema }).strict();
export const TokenParams = z.object({ token: z.string().min(10).max(200).regex(/^[A-Za-z0-9_-]+$/) }).strict();
