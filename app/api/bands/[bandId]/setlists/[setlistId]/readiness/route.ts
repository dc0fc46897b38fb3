// Ready for tonight: every member who will read this set list and each of their devices.
import { route } from "@/lib/server/handler";
import { setlistReadiness } from "@/lib/server/readiness";
import { SetlistParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const GET = route({ params: SetlistParams }, async ({ db, actor, params }) => ({
  readiness: await setlistReadiness(db, actor, params.bandId, params.setlistId),
}));
