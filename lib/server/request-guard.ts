import "server-only";
// What every request must pass before any work is done for it: a body no bigger than the route
// takes (refused from Content-Length, or as soon as the stream passes the limit), and for unsafe
// methods a browser request that comes from this site.
import { AppError } from "./errors";

export const KB = 1024;
export const MB = 1024 * KB;
/** The default body limit: a form or a small JSON edit. */
export const DEFAULT_BODY_BYTES = 64 * KB;

/** A chart edit: 50,000 characters of text, which JSON may escape to a few bytes each. */
export const CHART_BODY_BYTES = 512 * KB;
/** A set list with its entries and notes. */
export const SETLIST_BODY_BYTES = 256 * KB;

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

function tooBig(maxBytes: number): AppError {
  const size = maxBytes >= MB ? `${Math.round(maxBytes / MB)} MB` : `${Math.round(maxBytes / KB)} KB`;
  return new AppError("payload_too_large", `The request is larger than ${size}, the most this address takes.`);
}

/** Reads the body as text, refusing it (413) without reading the rest once it passes `maxBytes`. */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > maxBytes) {
    await request.body?.cancel().catch(() => undefined);
    throw tooBig(maxBytes);
  }
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooBig(maxBytes);
    }
    chunks.push(value);
  }
  const all = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    all.set(c, at);
    at += c.byteLength;
  }
  return new TextDecoder().decode(all);
}

/** The origins this app answers as: its own request origin and the configured public address. */
function ownOrigins(request: Request): Set<string> {
  const own = new Set<string>([new URL(request.url).origin]);
  const host = request.headers.get("host");
  const proto = request.headers.get("x-forwarded-proto") ?? new URL(request.url).protocol.replace(":", "");
  if (host) own.add(`${proto}://${host}`);
  const configured = process.env.NEXTAUTH_URL;
  if (configured) {
    try {
      own.add(new URL(configured).origin);
    } catch {
      // a malformed setting adds nothing
    }
  }
  return own;
}

/**
 * Unsafe methods from a browser must come from this site. Browsers send Origin on every POST/PUT/
 * PATCH/DELETE (and Sec-Fetch-Site where Origin is missing); a request with neither comes from a
 * script or server, which cannot carry a victim's cookie, so it is left to the session check.
 */
export function assertSameSite(request: Request): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  const origin = request.headers.get("origin");
  const refuse = () => new AppError("forbidden", "This request came from another site, so it was refused. Use Pedalpoint's own pages.");
  if (origin !== null) {
    if (origin === "null" || !ownOrigins(request).has(origin)) throw refuse();
    return;
  }
  const site = request.headers.get("sec-fetch-site");
  if (site !== null && site !== "same-origin" && site !== "none") throw refuse();
}

/**
 * Who is asking, for per-client limits: the address the nearest proxy saw. Behind a reverse proxy
 * that appends to X-Forwarded-For, the last entry is the one it added and cannot be forged; without
 * a proxy it is whatever the caller sent, which is why the per-address limits exist as well.
 */
export function clientKey(request: Request): string {
  const forwarded = request.headers.get("x-forwarded-for");
  const last = forwarded?.split(",").pop()?.trim();
  return (last || request.headers.get("x-real-ip") || "unknown").slice(0, 64);
}
