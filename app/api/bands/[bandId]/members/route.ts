import { NextResponse } from "next/server";
import { ready } from "@/db";
import { findMembership } from "@/lib/server/access";
import { route } from "@/lib/server/handler";
import { inviteMember, listInvites, listMembers } from "@/lib/server/members";
import { can } from "@/lib/band/roles";
import { BandParams, InviteCreateSchema } from "@/lib/validation/band";

export const GET = route({ params: BandParams }, async ({ actor, params }) => {
  const db = await ready();
  const members = await listMembers(db, actor, params.bandId);
  const me = actor ? await findMembership(db, actor.userId, params.bandId) : null;
  const leader = can(me?.role, "manageMembers");
  return { members, invites: leader ? await listInvites(db, actor, params.bandId) : [] };
});

export const POST = route({ params: BandParams, body: InviteCreateSchema }, async ({ actor, params, body }) =>
  NextResponse.json(await inviteMember(await ready(), actor, params.bandId, body), { status: 201 }),
);
