import { getBand } from "@/lib/server/bands";
import { route } from "@/lib/server/handler";
import { BandParams } from "@/lib/validation/params";

export const GET = route({ params: BandParams }, async ({ db, actor, params }) => ({ band: await getBand(db, actor, params.bandId) }));
