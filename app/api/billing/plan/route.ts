import { z } from "zod";
import { getPlanStatus } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

export const GET = route({ query: z.object({ bandId: IdSchema }).strict() }, async ({ db, actor, query }) => ({
  plan: await getPlanStatus(db, actor, query.bandId),
}));
