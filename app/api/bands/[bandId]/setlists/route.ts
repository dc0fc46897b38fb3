import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { createSetlist, listSetlists } from "@/lib/server/setlists";
import { SetlistCreateSchema } from "@/lib/setlist";
import { BandParams } from "@/lib/validation/band";

export const GET = route({ params: BandParams }, async ({ actor, params }) => ({
  setlists: await listSetlists(await ready(), actor, params.bandId),
}));

export const POST = route({ params: BandParams, body: SetlistCreateSchema }, async ({ actor, params, body }) => ({
  setlist: await createSetlist(await ready(), actor, params.bandId, body),
}));
