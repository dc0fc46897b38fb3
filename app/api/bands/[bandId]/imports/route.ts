import { route } from "@/lib/server/handler";
import { previewImportRequest } from "@/lib/server/imports";
import { BandParams } from "@/lib/validation/params";

// Multipart field "file": answers the preview of what was read and skipped; stores nothing.
export const POST = route({ params: BandParams, rawBody: true }, async ({ db, actor, params, request }) => ({
  preview: await previewImportRequest(db, actor, params.bandId, request),
}));
