import { deletePart, openPart, safeFilename } from "@/lib/server/parts";
import { route } from "@/lib/server/handler";
import { AttachmentParams as Params } from "@/lib/validation/params";

export const GET = route({ params: Params }, async ({ db, actor, params }) => {
  const part = await openPart(db, actor, params.bandId, params.chartId, params.attachmentId);
  // Object storage with signed addresses: the member fetches the bytes from the store directly.
  if (part.url !== undefined) return new Response(null, { status: 302, headers: { location: part.url, "cache-control": "no-store" } });
  // Streamed from the store as they arrive, never held whole here.
  return new Response(part.stream, {
    headers: {
      "content-type": part.dto.type,
      "content-length": String(part.size),
      "content-disposition": `inline; filename="${safeFilename(part.dto.filename)}"`,
      "x-content-type-options": "nosniff",
      // the file behind an id never changes (it is stored under its hash)
      "cache-control": "private, max-age=31536000, immutable",
      etag: `"${part.dto.sha256}"`,
    },
  });
});

export const DELETE = route({ params: Params }, async ({ db, actor, params }) => {
  await deletePart(db, actor, params.bandId, params.chartId, params.attachmentId);
  return { ok: true };
});
