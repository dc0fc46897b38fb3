import { NextResponse } from "next/server";
import { createBand, listMyBands } from "@/lib/server/bands";
import { route } from "@/lib/server/handler";
import { BandCreateSchema } from "@/lib/validation/band";

export const GET = route({}, async ({ db, actor }) => ({ bands: await listMyBands(db, actor) }));

export const POST = route({ body: BandCreateSchema }, async ({ db, actor, body }) =>
  NextResponse.json({ band: await createBand(db, actor, body) }, { status: 201 }),
);
