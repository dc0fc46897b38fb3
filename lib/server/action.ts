import "server-only";
// The server actions' counterpart of route(): parses the address parameters the action was bound
// to with the same schemas as the routes, resolves the signed-in user (never null inside), hands
// over the database, and turns errors into a plain failure the form can show. A bad id is a 400
// like on a route, not an internal error; only unexpected errors are logged.
import type { Kysely } from "kysely";
import type { ZodType } from "zod";
import { ready } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "./access";
import { AppError, type ErrorCode, type FieldIssue } from "./errors";
import { parseInput } from "./input";
import { getActor } from "./session";

export interface ActionCtx<P> {
  db: Kysely<Database>;
  actor: Actor;
  params: P;
}

export interface ActionFailure {
  code: ErrorCode | "internal";
  message: string;
  fields: FieldIssue[];
}

export type ActionOutcome<R> = { ok: true; value: R } | { ok: false; failure: ActionFailure };

const INTERNAL: ActionFailure = {
  code: "internal",
  message: "Something went wrong on the server. Nothing was changed.",
  fields: [],
};

function failureOf(err: unknown): ActionFailure {
  if (err instanceof AppError) return { code: err.code, message: err.message, fields: err.details?.fields ?? [] };
  console.error(err);
  return INTERNAL;
}

export async function action<P, R>(
  spec: { params: ZodType<P> },
  rawParams: unknown,
  fn: (ctx: ActionCtx<P>) => Promise<R>,
): Promise<ActionOutcome<R>> {
  try {
    const params = parseInput(spec.params, rawParams, { code: "bad_request", fallback: "Invalid address." });
    const actor = await getActor();
    if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
    return { ok: true, value: await fn({ db: await ready(), actor, params }) };
  } catch (err) {
    return { ok: false, failure: failureOf(err) };
  }
}
