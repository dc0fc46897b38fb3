import { NextResponse } from "next/server";
import { listParts, uploadPartRequest } from "@/lib/server/parts";
import { route } from "@/lib/server/handler";
import { announce } from "@/lib/server/push-announce";
import { ChartParams } from "@/lib/validation/params";

export const GET = route({ params: ChartParams }, async ({ db, actor, params }) => ({
  attachments: await listParts(db, actor, params.bandId, params.chartId),
}));

// Multipart field "file": a PDF, PNG or JPEG part of the chart.
export const POST = route({ params: ChartParams, rawBody: true }, async ({ db, actor, params, request }) => {
  const attachment = await uploadPartRequest(db, actor, params.bandId, params.chartId, request);
  announce(db, { bandId: params.bandId, authorId: actor?.userId ?? null, kind: "part", chartIds: [params.chartId] });
  return NextResponse.json({ attachment }, { status: 201 });
});
