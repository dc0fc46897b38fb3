import { NextResponse } from "next/server";
import { ready } from "@/db";
import { createBand, listMyBands } from "@/lib/server/bands";
import { route } from "@/lib/server/handler";
import { BandCreateSchema } from "@/lib/validation/band";

export const GET = route({}, async ({ actor }) => ({ bands: await listMyBands(await ready(), actor) }));

export const POST = route({ body: BandCreateSchema }, async ({ actor, body }) =>
  NextResponse.json({ band: await createBand(await ready(), actor, body) }, { status: 201 }),
);
