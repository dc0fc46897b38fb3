import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { removeMember, updateMember } from "@/lib/server/members";
import { MemberUpdateSchema } from "@/lib/validation/band";
import { MemberParams } from "@/lib/validation/params";

export const PATCH = route({ params: MemberParams, body: MemberUpdateSchema }, async ({ actor, params, body }) => ({
  member: await updateMember(await ready(), actor, params.bandId, params.userId, body),
}));

export const DELETE = route({ params: MemberParams }, async ({ actor, params }) => {
  await removeMember(await ready(), actor, params.bandId, params.userId);
  return { ok: true };
});
