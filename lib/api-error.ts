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

/** The `error` of a failed answer, or null when the body is not our JSON. */
export async function readErrorBody(res: Response): Promise<ErrorBody | null> {
  const body = (await res.json().catch(() => null)) as { error?: ErrorBody } | null;
  return body && typeof body.error === "object" && body.error !== null ? body.error : null;
}

export interface ApiError {
  message: string;
  code?: string;
  /** The first field the server named, so the form can put the message beside it. */
  field?: string;
}

/** What a screen shows for a failed answer. */
export async function readApiError(res: Response, fallback: string): Promise<ApiError> {
  const error = await readErrorBody(res);
  return { message: error?.message ?? fallback, code: error?.code, field: error?.fields?.[0]?.field };
}
