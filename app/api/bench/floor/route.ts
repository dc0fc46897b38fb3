// The benchmark's floor: a bare route in the same build and process as the sync route, answering a
// fixed body from memory with no session, database or parsing. It exists only when the benchmark
// starts the server with PEDALPOINT_BENCH_FLOOR pointing at a folder; otherwise it is a plain 404.
//   ?body=ok   → {"ok":true}          (floor of an empty sync poll)
//   ?body=page → <folder>/page.json   (floor of a full page: the same bytes the sync route sent)
import fs from "node:fs";
import path from "node:path";

export const dynamic = "force-dynamic";

const bodies = new Map<string, Buffer<ArrayBuffer>>();
const OK = Buffer.from('{"ok":true}');

function body(name: string, dir: string): Buffer<ArrayBuffer> | null {
  if (name === "ok") return OK;
  if (name !== "page") return null;
  let b = bodies.get(name);
  if (!b) bodies.set(name, (b = fs.readFileSync(path.join(dir, "page.json"))));
  return b;
}

export function GET(request: Request): Response {
  const dir = process.env.PEDALPOINT_BENCH_FLOOR;
  const b = dir ? body(new URL(request.url).searchParams.get("body") ?? "ok", dir) : null;
  if (!b) return new Response("Not found", { status: 404 });
  return new Response(b, { headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" } });
}
