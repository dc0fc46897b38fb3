// A device says what it holds of the band's upcoming gigs, right after a successful pull.
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { DeviceReportSchema, recordDeviceReport } from "@/lib/server/readiness";
import { BandParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const POST = route({ params: BandParams, body: DeviceReportSchema }, async ({ actor, params, body }) => {
  await recordDeviceReport(await ready(), actor, params.bandId, body);
  return { ok: true };
});
