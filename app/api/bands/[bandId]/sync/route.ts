// Delta sync for one band: GET pulls a page of the feed, POST pushes a device's queued edits.
import { z } from "zod";
import { ready } from "@/db";
import { PullQuerySchema, PushBodySchema } from "@/lib/offline/protocol";
import { route } from "@/lib/server/handler";
import { pullChanges, pushMutations } from "@/lib/server/sync";
import { announceApplied } from "@/lib/server/push-announce";

export const dynamic = "force-dynamic";

const Params = z.object({ bandId: z.string().min(1).max(64) });

const utf8 = new TextEncoder();

export const GET = route({ params: Params, query: PullQuerySchema }, async ({ actor, params, query }) => {
  const body = await pullChanges(await ready(), actor, params.bandId, query);
  // Bytes, not a string: a string body is measured (byteLength) and then encoded, two passes over a
  // page that can be a few hundred KB.
  return new Response(utf8.encode(body), { headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" } });
});

export const POST = route({ params: Params, body: PushBodySchema }, async ({ actor, params, body }) => {
  const db = await ready();
  const out = await pushMutations(db, actor, params.bandId, body.mutations);
  announceApplied(db, actor, params.bandId, body.mutations, out.results);
  return Response.json(out, { headers: { "cache-control": "no-store" } });
});
