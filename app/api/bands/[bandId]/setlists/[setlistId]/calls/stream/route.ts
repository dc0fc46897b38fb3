// Server-sent events: each tune called on this gig, resumed from Last-Event-ID after a reconnect.
import { z } from "zod";
import { gigReader } from "@/lib/server/calls";
import { callStream } from "@/lib/server/calls-stream";
import { route } from "@/lib/server/handler";
import { SetlistParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

const Query = z.object({ after: z.coerce.number().int().min(0).optional() }).strict();

export const GET = route({ params: SetlistParams, query: Query }, async ({ db, actor, params, query, request }) => {
  await gigReader(db, actor, params.bandId, params.setlistId);
  const header = request.headers.get("last-event-id");
  const fromHeader = header && /^\d{1,15}$/.test(header) ? Number(header) : null;
  return callStream(db, params.setlistId, fromHeader ?? query.after ?? null, request.signal);
});
