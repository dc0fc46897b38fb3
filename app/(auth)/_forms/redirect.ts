import { safeCallbackPath } from "@/lib/validation/callback";

// Where to go after signing in: only same-site paths, so a crafted link cannot send anyone away.
export function safePath(callbackUrl: string | null | undefined, fallback = "/bands"): string {
  return safeCallbackPath(callbackUrl, fallback);
}

/** A full load, so server components and the service worker see the new session. */
export function go(path: string): void {
  window.location.assign(path);
}

interface ApiFailure {
  error?: { message?: string; fields?: { field: string; message: string }[] };
}

export async function readFailure(res: Response): Promise<{ message: string; fields: Record<string, string> }> {
  const data = (await res.json().catch(() => ({}))) as ApiFailure;
  const fields: Record<string, string> = {};
  for (const f of data.error?.fields ?? []) fields[f.field] ??= f.message;
  return { message: data.error?.message ?? "Something went wrong. Try again.", fields };
}
