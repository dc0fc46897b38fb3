import "server-only";
// A pull page as an HTTP response: its UTF-8 bytes, made once per page (pull-cache.ts). Compression is
// left to the server: `next start` gzips any response when the device asks for it, and Next drops a
// Content-Encoding set by a route handler, so a route cannot send bytes it compressed itself.
import type { PullBody } from "./pull-cache";

export function pullResponse(body: PullBody): Response {
  return new Response(body.bytes() as Uint8Array<ArrayBuffer>, { headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" } });
}
