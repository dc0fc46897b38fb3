// Route handlers called as a stranger's request would reach them: a real SQLite file, real
// wrapper (Origin check, body limits, rate limits), a settable signed-in actor, mail captured.
import type { Actor } from "@/lib/server/access";

export const APP = "http://localhost:3000";

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface Sent {
  method?: string;
  params?: Record<string, string>;
  body?: unknown;
  raw?: BodyInit;
  headers?: Record<string, string>;
  /** The page the request claims to come from; default this app (what the app's own pages send). */
  origin?: string | null;
  client?: string;
}

export async function send(h: Handler, s: Sent = {}) {
  const headers: Record<string, string> = { "content-type": "application/json", ...(s.headers ?? {}) };
  if (s.origin !== null) headers.origin = s.origin ?? APP;
  if (s.client) headers["x-forwarded-for"] = s.client;
  const init: RequestInit & { duplex?: string } = { method: s.method ?? "POST", headers };
  if (s.raw !== undefined) {
    init.body = s.raw;
    init.duplex = "half";
  } else if (s.body !== undefined) init.body = JSON.stringify(s.body);
  const res = await h(new Request(`${APP}/api/x`, init), { params: Promise.resolve(s.params ?? {}) });
  const text = await res.text();
  let json: { error?: { code: string; message: string; retryAfter?: number } } & Record<string, unknown> = {};
  try {
    json = JSON.parse(text) as typeof json;
  } catch {
    // not JSON
  }
  return { status: res.status, headers: res.headers, json };
}

export const actorBox: { actor: Actor | null } = { actor: null };
