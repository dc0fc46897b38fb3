// The leader nudges members whose devices are behind: a push, or e-mail when they have no subscription.
import { route } from "@/lib/server/handler";
import { NudgeSchema, nudgeMembers } from "@/lib/server/readiness";
import { SetlistParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const POST = route({ params: SetlistParams, body: NudgeSchema }, async ({ db, actor, params, body }) => ({
  nudged: await nudgeMembers(db, actor, params.bandId, params.setlistId, body.userIds),
}));
