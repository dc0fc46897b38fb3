// Delta sync for one band: GET pulls a page of the feed, POST pushes a device's queued edits.
import { z } from "zod";
import { ready } from "@/db";
import { PullQuerySchema, PushBodySchema } from "@/lib/offline/protocol";
import { route } from "@/lib/server/handler";
import { pushMutations } from "@/lib/server/sync";
import { pullBody } from "@/lib/server/sync-pull";
import { pullResponse } from "@/lib/server/sync-response";

export const dynamic = "force-dynamic";

const Params = z.object({ bandId: z.string().min(1).max(64) });

export const GET = route({ params: Params, query: PullQuerySchema }, async ({ actor, params, query }) => {
  return pullResponse(await pullBody(await ready(), actor, params.bandId, query));
});

export const POST = route({ params: Params, body: PushBodySchema }, async ({ actor, params, body }) => {
  const out = await pushMutations(await ready(), actor, params.bandId, body.mutations);
  return Response.json(out, { headers: { "cache-control": "no-store" } });
});
