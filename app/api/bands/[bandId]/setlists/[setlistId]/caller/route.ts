// The leader hands calling the tunes to a member for this gig, or takes it back (userId: null).
import { CallerSchema, setCaller } from "@/lib/server/calls";
import { route } from "@/lib/server/handler";
import { SetlistParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const PUT = route({ params: SetlistParams, body: CallerSchema }, async ({ db, actor, params, body }) => setCaller(db, actor, params.bandId, params.setlistId, body.userId));
