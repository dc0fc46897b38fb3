// Address params of the set-list routes.
import { z } from "zod";
import { IdSchema } from "@/lib/validation/common";

export const SetlistParams = z.object({ bandId: IdSchema, setlistId: IdSchema }).strict();
export const ShareParams = z.object({ bandId: IdSchema, setlistId: IdSchema, shareId: IdSchema }).strict();
