// A device says what it holds of the band's upcoming gigs, right after a successful pull.
import { route } from "@/lib/server/handler";
import { DeviceReportSchema, recordDeviceReport } from "@/lib/server/readiness";
import { BandParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const POST = route({ params: BandParams, body: DeviceReportSchema }, async ({ db, actor, params, body }) => {
  await recordDeviceReport(db, actor, params.bandId, body);
  return { ok: true };
});
