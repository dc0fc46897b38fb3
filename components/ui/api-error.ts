// One way to read a failed answer from our routes: { error: { code, message, fields } }, or words of
// our own when the body is not JSON (a proxy's page, an empty answer).

export interface ApiError {
  message: string;
  code?: string;
  /** The first field the server named, so the form can put the message beside it. */
  field?: string;
}

export async function readApiError(res: Response, fallback: string): Promise<ApiError> {
  const body = (await res.json().catch(() => null)) as { error?: { message?: string; code?: string; fields?: { field: string }[] } } | null;
  const error = body?.error;
  return { message: error?.message ?? fallback, code: error?.code, field: error?.fields?.[0]?.field };
}
