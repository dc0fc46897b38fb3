import { z } from "zod";
import { startCheckout } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

export const POST = route({ body: z.object({ bandId: IdSchema }).strict() }, async ({ db, actor, body }) =>
  startCheckout(db, actor, body.bandId),
);
