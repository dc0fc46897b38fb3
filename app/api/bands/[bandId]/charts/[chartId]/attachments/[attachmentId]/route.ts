import { z } from "zod";
import { ready } from "@/db";
import { deleteAttachment, readAttachment } from "@/lib/server/attachments";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

const Params = z.object({ bandId: IdSchema, chartId: IdSchema, attachmentId: IdSchema }).strict();

export const GET = route({ params: Params }, async ({ actor, params }) => {
  const { dto, bytes } = await readAttachment(await ready(), actor, params.bandId, params.chartId, params.attachmentId);
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": dto.type,
      "content-length": String(bytes.byteLength),
      "content-disposition": `inline; filename="${dto.filename.replace(/[^\x20-\x7e]/g, "_").replace(/"/g, "'")}"`,
      "x-content-type-options": "nosniff",
      // the file behind an id never changes (it is stored under its hash)
      "cache-control": "private, max-age=31536000, immutable",
      etag: `"${dto.sha256}"`,
    },
  });
});

export const DELETE = route({ params: Params }, async ({ actor, params }) => {
  await deleteAttachment(await ready(), actor, params.bandId, params.chartId, params.attachmentId);
  return { ok: true };
});
