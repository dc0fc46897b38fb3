import { safeCallbackPath } from "@/lib/validation/callback";
import { fieldMessages, readErrorBody } from "@/lib/api-error";

// Where to go after signing in: only same-site paths, so a crafted link cannot send anyone away.
export function safePath(callbackUrl: string | null | undefined, fallback = "/bands"): string {
  return safeCallbackPath(callbackUrl, fallback);
}

/** A full load, so server components and the service worker see the new session. */
export function go(path: string): void {
  window.location.assign(path);
}

export async function readFailure(res: Response): Promise<{ message: string; fields: Record<string, string> }> {
  const error = await readErrorBody(res);
  return { message: error?.message ?? "Something went wrong. Try again.", fields: fieldMessages(error) };
}
