import { route } from "@/lib/server/handler";
import { setMyInstrument } from "@/lib/server/members";
import { MyInstrumentSchema } from "@/lib/validation/band";

export const PUT = route({ body: MyInstrumentSchema }, async ({ db, actor, body }) => setMyInstrument(db, actor, body));
