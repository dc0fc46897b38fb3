import "server-only";
// One wrapper for every route handler: refuses cross-site unsafe requests and oversized bodies,
// counts anonymous callers against their limit, resolves the user, parses params, query and body
// with zod, and turns AppErrors into JSON responses. Role checks happen in the use case it calls.
import { NextResponse } from "next/server";
import type { ZodType } from "zod";
import { ready } from "@/db";
import type { Kysely } from "kysely";
import type { Database as Tables } from "@/db/schema";
import type { Actor } from "./access";
import { AppError } from "./errors";
import { parseInput } from "./input";
import { consume, type LimitSpec } from "./rate-limit";
import { assertSameSite, clientKey, DEFAULT_BODY_BYTES, readBodyText } from "./request-guard";
import { getActor } from "./session";

function parseOrThrow<T>(schema: ZodType<T>, value: unknown, where: "address" | "query" | "body"): T {
  return parseInput(schema, value, { code: where === "body" ? "unprocessable" : "bad_request", fallback: `Invalid ${where}.` });
}

export function errorResponse(err: unknown): NextResponse {
  if (err instanceof AppError) {
    const retryAfter = err.details?.retryAfter;
    const headers = err.code === "rate_limited" && typeof retryAfter === "number" ? { "retry-after": String(retryAfter) } : undefined;
    return NextResponse.json({ error: { code: err.code, message: err.message, ...err.details } }, { status: err.status, headers });
  }
  console.error(err);
  // Said without a promise about the data: a batch may have stored part of its work before failing.
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on the server. Try again in a moment." } }, { status: 500 });
}

interface Spec<P, Q, B, Anon extends boolean> {
  params?: ZodType<P>;
  query?: ZodType<Q>;
  body?: ZodType<B>;
  /** Allow anonymous callers (sign-up, webhooks); without it the handler's actor is never null. */
  anonymous?: Anon;
  /** Largest body this route reads (bytes); DEFAULT_BODY_BYTES unless said. */
  maxBytes?: number;
  /** A per-client limit counted before any other work. */
  limit?: LimitSpec;
  /** The route reads the body itself (uploads, signed webhooks): it gets the request untouched. */
  rawBody?: boolean;
}

/** Who is asking: always someone on a route that needs sign-in, maybe no one on an anonymous one. */
export type ActorFor<Anon extends boolean> = Anon extends true ? Actor | null : Actor;

interface Ctx<P, Q, B, Anon extends boolean> {
  actor: ActorFor<Anon>;
  /** The database, migrated and ready. */
  db: Kysely<Tables>;
  params: P;
  query: Q;
  body: B;
  request: Request;
  /** The body as text, when the route asked for `rawBody: "text"` semantics via maxBytes and no schema. */
  text: string;
  /** Who is asking, for per-client limits inside the use case. */
  client: string;
}

type RouteContext = { params: Promise<Record<string, string | string[]>> };

export function route<P = Record<string, never>, Q = Record<string, never>, B = undefined, Anon extends boolean = false>(
  spec: Spec<P, Q, B, Anon>,
  fn: (ctx: Ctx<P, Q, B, Anon>) => Promise<unknown>,
) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      assertSameSite(request);
      const client = clientKey(request);
      if (spec.limit) await consume(await ready(), spec.limit, client);
      let text = "";
      const hasBody = !["GET", "HEAD"].includes(request.method.toUpperCase());
      if (hasBody && !spec.rawBody) text = await readBodyText(request, spec.maxBytes ?? DEFAULT_BODY_BYTES);
      const actor = await getActor();
      if (!actor && !spec.anonymous) throw new AppError("unauthenticated", "Please sign in first.");
      const rawParams = context?.params ? await context.params : {};
      const params = spec.params ? parseOrThrow(spec.params, rawParams, "address") : (rawParams as P);
      const url = new URL(request.url);
      const query = spec.query ? parseOrThrow(spec.query, Object.fromEntries(url.searchParams), "query") : ({} as Q);
      let body = undefined as B;
      if (spec.body) {
        let json: unknown;
        try {
          json = JSON.parse(text);
        } catch {
          throw new AppError("bad_request", "The request body is not valid JSON.");
        }
        body = parseOrThrow(spec.body, json, "body");
      }
      const db = await ready();
      const result = await fn({ actor: actor as ActorFor<Anon>, db, params, query, body, request, text, client });
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true });
    } catch (err) {
      return errorResponse(err);
    }
  };
}
