import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { setMyInstrument } from "@/lib/server/members";
import { MyInstrumentSchema } from "@/lib/validation/band";

export const PUT = route({ body: MyInstrumentSchema }, async ({ actor, body }) => setMyInstrument(await ready(), actor, body));
