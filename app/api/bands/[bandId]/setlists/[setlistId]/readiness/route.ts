// Ready for tonight: every member who will read this set list and each of their devices.
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { setlistReadiness } from "@/lib/server/readiness";
import { SetlistParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const GET = route({ params: SetlistParams }, async ({ actor, params }) => ({
  readiness: await setlistReadiness(await ready(), actor, params.bandId, params.setlistId),
}));
