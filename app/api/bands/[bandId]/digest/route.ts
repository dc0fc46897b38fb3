import { sendChartsUpdatedDigest } from "@/lib/server/digest";
import { route } from "@/lib/server/handler";
import { BandParams } from "@/lib/validation/params";

// Mails the band the charts published since the last notice. No body: there is nothing to choose.
export const POST = route({ params: BandParams }, async ({ db, actor, params }) =>
  sendChartsUpdatedDigest(db, actor, params.bandId),
);
