import "server-only";
// One wrapper for every route handler: resolves the user, parses params, query and body with zod,
// and turns AppErrors into JSON responses. Role checks happen in the use case it calls.
import { NextResponse } from "next/server";
import { z, type ZodType } from "zod";
import type { Actor } from "./access";
import { AppError, type FieldIssue } from "./errors";
import { getActor } from "./session";

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ field: i.path.join(".") || "(body)", message: i.message }));
}

function parseOrThrow<T>(schema: ZodType<T>, value: unknown, where: string): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const fields = zodIssues(r.error);
  const first = fields[0];
  throw new AppError(
    where === "body" ? "unprocessable" : "bad_request",
    first ? `${first.field}: ${first.message}` : `Invalid ${where}.`,
    { fields },
  );
}

export function errorResponse(err: unknown): NextResponse {
  if (err instanceof AppError) {
    return NextResponse.json({ error: { code: err.code, message: err.message, ...err.details } }, { status: err.status });
  }
  console.error(err);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on the server. Your data was not changed." } }, { status: 500 });
}

interface Spec<P, Q, B> {
  params?: ZodType<P>;
  query?: ZodType<Q>;
  body?: ZodType<B>;
  /** Allow anonymous callers (sign-up, webhooks). */
  anonymous?: boolean;
}

interface Ctx<P, Q, B> {
  actor: Actor | null;
  params: P;
  query: Q;
  body: B;
  request: Request;
}

type RouteContext = { params: Promise<Record<string, string | string[]>> };

export function route<P = Record<string, never>, Q = Record<string, never>, B = undefined>(
  spec: Spec<P, Q, B>,
  fn: (ctx: Ctx<P, Q, B>) => Promise<unknown>,
) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
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
          json = await request.json();
        } catch {
          throw new AppError("bad_request", "The request body is not valid JSON.");
        }
        body = parseOrThrow(spec.body, json, "body");
      }
      const result = await fn({ actor, params, query, body, request });
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true });
    } catch (err) {
      return errorResponse(err);
    }
  };
}
