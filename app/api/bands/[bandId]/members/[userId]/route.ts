import { route } from "@/lib/server/handler";
import { removeMember, updateMember } from "@/lib/server/members";
import { MemberUpdateSchema } from "@/lib/validation/band";
import { MemberParams } from "@/lib/validation/params";

export const PATCH = route({ params: MemberParams, body: MemberUpdateSchema }, async ({ db, actor, params, body }) => ({
  member: await updateMember(db, actor, params.bandId, params.userId, body),
}));

export const DELETE = route({ params: MemberParams }, async ({ db, actor, params }) => {
  await removeMember(db, actor, params.bandId, params.userId);
  return { ok: true };
});
