import { z } from "zod";
import { ready } from "@/db";
import { startCheckout } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

export const POST = route({ body: z.object({ bandId: IdSchema }).strict() }, async ({ actor, body }) =>
  startCheckout(await ready(), actor, body.bandId),
);
