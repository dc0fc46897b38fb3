import { z } from "zod";
import { ready } from "@/db";
import { getPlanStatus } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

export const GET = route({ query: z.object({ bandId: IdSchema }).strict() }, async ({ actor, query }) => ({
  plan: await getPlanStatus(await ready(), actor, query.bandId),
}));
