// Where to go after signing in: only a path on this site. Shared by the sign-in forms (client) and
// next-auth's redirect rule (server), so both refuse the same tricks: `//host`, `/\host` (browsers
// read `\` as `/`), tabs or newlines inside (browsers drop them, turning `/<TAB>/host` into `//host`),
// and anything that does not resolve to this origin.
const PROBE = "https://pedalpoint.invalid";

export function safeCallbackPath(callbackUrl: string | null | undefined, fallback = "/"): string {
  if (!callbackUrl || callbackUrl.length > 2_000) return fallback;
  if (!callbackUrl.startsWith("/")) return fallback;
  if (/[\\\u0000-\u001f\u007f\s]/.test(callbackUrl)) return fallback;
  if (callbackUrl.startsWith("//")) return fallback;
  let url: URL;
  try {
    url = new URL(callbackUrl, PROBE);
  } catch {
    return fallback;
  }
  if (url.origin !== PROBE) return fallback;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** The server side: next-auth hands full URLs too; only this site's own are kept. */
export function safeRedirect(url: string, baseUrl: string): string {
  if (url.startsWith("/")) return `${baseUrl}${safeCallbackPath(url)}`;
  try {
    const u = new URL(url);
    const base = new URL(baseUrl);
    if (u.origin === base.origin) return `${baseUrl}${safeCallbackPath(`${u.pathname}${u.search}${u.hash}`)}`;
  } catch {
    // not a URL: fall through to the home page
  }
  return baseUrl;
}
