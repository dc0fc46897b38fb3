import { NextResponse } from "next/server";
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { confirmImport, ImportConfirmSchema } from "@/lib/server/imports";
import { BandParams } from "@/lib/validation/band";

export const POST = route({ params: BandParams, body: ImportConfirmSchema }, async ({ actor, params, body }) =>
  NextResponse.json({ chart: await confirmImport(await ready(), actor, params.bandId, body) }, { status: 201 }),
);
