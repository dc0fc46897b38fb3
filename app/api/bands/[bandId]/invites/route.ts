import { NextResponse } from "next/server";
import { route } from "@/lib/server/handler";
import { inviteMember, listInvites } from "@/lib/server/members";
import { InviteCreateSchema } from "@/lib/validation/band";
import { BandParams } from "@/lib/validation/params";

export const GET = route({ params: BandParams }, async ({ db, actor, params }) => ({
  invites: await listInvites(db, actor, params.bandId),
}));

export const POST = route({ params: BandParams, body: InviteCreateSchema }, async ({ db, actor, params, body }) =>
  NextResponse.json(await inviteMember(db, actor, params.bandId, body), { status: 201 }),
);
