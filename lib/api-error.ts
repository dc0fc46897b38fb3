// One way to read a failed answer from our routes: { error: { code, message, fields, current } }, or
// words of our own when the body is not JSON (a proxy's page, an empty answer).

/** A field the server refused, with the line and column for the chart text. */
export interface FieldProblem {
  field: string;
  message: string;
  line?: number;
  column?: number;
}

/** The error body of a route's answer (lib/server/errors.ts writes it). */
export interface ErrorBody {
  code?: string;
  message?: string;
  fields?: FieldProblem[];
  /** On a conflict: the server's current version of what was being saved. */
  current?: unknown;
}

/** The `error` of an answer's parsed body, or null when it is not our shape. */
export function errorBodyOf(body: unknown): ErrorBody | null {
  const error = (body as { error?: unknown } | null)?.error;
  if (typeof error !== "object" || error === null) return null;
  const e = error as Record<string, unknown>;
  return {
    ...(typeof e.code === "string" ? { code: e.code } : {}),
    ...(typeof e.message === "string" ? { message: e.message } : {}),
    ...(Array.isArray(e.fields) ? { fields: e.fields as FieldProblem[] } : {}),
    ...(e.current ? { current: e.current } : {}),
  };
}

/** The `error` of a failed answer, or null when the body is not our JSON. */
export async function readErrorBody(res: Response): Promise<ErrorBody | null> {
  return errorBodyOf(await res.json().catch(() => null));
}

export interface ApiError {
  message: string;
  code?: string;
  /** The first field the server named, so the form can put the message beside it. */
  field?: string;
}

/** What a screen shows for an answer's parsed body (an upload's, read by XMLHttpRequest). */
export function apiErrorOf(body: unknown, fallback: string): ApiError {
  const error = errorBodyOf(body);
  return { message: error?.message ?? fallback, code: error?.code, field: error?.fields?.[0]?.field };
}

/** What a screen shows for a failed answer. */
export async function readApiError(res: Response, fallback: string): Promise<ApiError> {
  return apiErrorOf(await res.json().catch(() => null), fallback);
}

/** Each refused field's first message, by field name, for a form. */
export function fieldMessages(error: ErrorBody | null): Record<string, string> {
  const out: Record<string, string> = {};
  for (const f of error?.fields ?? []) out[f.field] ??= f.message;
  return out;
}
