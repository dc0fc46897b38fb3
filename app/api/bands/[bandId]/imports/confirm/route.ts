import { NextResponse } from "next/server";
import { route } from "@/lib/server/handler";
import { CHART_BODY_BYTES } from "@/lib/server/request-guard";
import { confirmImport, ImportConfirmSchema } from "@/lib/server/imports";
import { BandParams } from "@/lib/validation/params";

export const POST = route({ params: BandParams, body: ImportConfirmSchema, maxBytes: CHART_BODY_BYTES }, async ({ db, actor, params, body }) =>
  NextResponse.json({ chart: await confirmImport(db, actor, params.bandId, body) }, { status: 201 }),
);
