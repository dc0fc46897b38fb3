import { NextResponse } from "next/server";
import { findMembership } from "@/lib/server/access";
import { route } from "@/lib/server/handler";
import { inviteMember, listInvites, listMembers } from "@/lib/server/members";
import { can } from "@/lib/band/roles";
import { InviteCreateSchema } from "@/lib/validation/band";
import { BandParams } from "@/lib/validation/params";

export const GET = route({ params: BandParams }, async ({ db, actor, params }) => {
  const members = await listMembers(db, actor, params.bandId);
  const me = actor ? await findMembership(db, actor.userId, params.bandId) : null;
  const leader = can(me?.role, "manageMembers");
  return { members, invites: leader ? await listInvites(db, actor, params.bandId) : [] };
});

export const POST = route({ params: BandParams, body: InviteCreateSchema }, async ({ db, actor, params, body }) =>
  NextResponse.json(await inviteMember(db, actor, params.bandId, body), { status: 201 }),
);
