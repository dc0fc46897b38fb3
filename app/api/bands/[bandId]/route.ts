import { ready } from "@/db";
import { getBand } from "@/lib/server/bands";
import { route } from "@/lib/server/handler";
import { BandParams } from "@/lib/validation/params";

export const GET = route({ params: BandParams }, async ({ actor, params }) => ({ band: await getBand(await ready(), actor, params.bandId) }));
