import { NextResponse } from "next/server";
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { inviteMember, listInvites } from "@/lib/server/members";
import { InviteCreateSchema } from "@/lib/validation/band";
import { BandParams } from "@/lib/validation/params";

export const GET = route({ params: BandParams }, async ({ actor, params }) => ({
  invites: await listInvites(await ready(), actor, params.bandId),
}));

export const POST = route({ params: BandParams, body: InviteCreateSchema }, async ({ actor, params, body }) =>
  NextResponse.json(await inviteMember(await ready(), actor, params.bandId, body), { status: 201 }),
);
