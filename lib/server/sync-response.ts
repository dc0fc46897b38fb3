import "server-only";
// A pull page as an HTTP response: its bytes (made once per page, see pull-cache.ts), gzipped when the
// device accepts gzip and the page is worth compressing. A body that already carries Content-Encoding
// is left alone by the framework's own compression, which would spend zlib level 6 on every request.
import type { PullBody } from "./pull-cache";

/** Below this a pull (an empty poll is ~250 bytes) costs more to compress than it saves. */
const GZIP_FROM_BYTES = 2048;

/** Whether an Accept-Encoding header takes gzip (named, or `*`, with a q-value above 0). */
export function acceptsGzip(header: string | null): boolean {
  if (!header) return false;
  return header.split(",").some((item) => {
    const [name = "", ...params] = item.split(";").map((p) => p.trim().toLowerCase());
    if (name !== "gzip" && name !== "*") return false;
    const q = params.find((p) => p.startsWith("q="));
    return q === undefined || Number(q.slice(2)) > 0;
  });
}

export function pullResponse(body: PullBody, acceptEncoding: string | null): Response {
  const headers: Record<string, string> = { "content-type": "application/json; charset=utf-8", "cache-control": "no-store", vary: "Accept-Encoding" };
  const bytes = body.bytes();
  if (bytes.byteLength < GZIP_FROM_BYTES || !acceptsGzip(acceptEncoding)) return new Response(bytes as Uint8Array<ArrayBuffer>, { headers });
  return new Response(body.gzip() as Uint8Array<ArrayBuffer>, { headers: { ...headers, "content-encoding": "gzip" } });
}
