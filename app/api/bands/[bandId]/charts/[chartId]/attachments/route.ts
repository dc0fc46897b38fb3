import { NextResponse } from "next/server";
import { ready } from "@/db";
import { listAttachments, uploadAttachmentRequest } from "@/lib/server/attachments";
import { route } from "@/lib/server/handler";
import { announce } from "@/lib/server/push-announce";
import { ChartParams } from "@/lib/validation/params";

export const GET = route({ params: ChartParams }, async ({ actor, params }) => ({
  attachments: await listAttachments(await ready(), actor, params.bandId, params.chartId),
}));

// Multipart field "file": a PDF, PNG or JPEG part of the chart.
export const POST = route({ params: ChartParams, rawBody: true }, async ({ actor, params, request }) => {
  const db = await ready();
  const attachment = await uploadAttachmentRequest(db, actor, params.bandId, params.chartId, request);
  announce(db, { bandId: params.bandId, authorId: actor?.userId ?? null, kind: "part", chartIds: [params.chartId] });
  return NextResponse.json({ attachment }, { status: 201 });
});
