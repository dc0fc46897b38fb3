// A device says what it holds of the band's upcoming gigs, right after a successful pull.
import { z } from "zod";
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { DeviceReportSchema, recordDeviceReport } from "@/lib/server/readiness";
import { IdSchema } from "@/lib/validation/common";

export const dynamic = "force-dynamic";

export const POST = route({ params: z.object({ bandId: IdSchema }).strict(), body: DeviceReportSchema }, async ({ actor, params, body }) => {
  await recordDeviceReport(await ready(), actor, params.bandId, body);
  return { ok: true };
});
