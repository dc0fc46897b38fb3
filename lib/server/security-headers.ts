// The response headers that keep pages safe in a browser. Pure (no Node APIs) so the proxy, which
// runs before every page, can use it.
//
// The Content-Security-Policy gives scripts a per-request nonce ('strict-dynamic' lets Next's own
// nonce'd scripts load their chunks, and pdf.js and VexFlow load as chunks); styles allow inline
// because React, VexFlow and pdf.js set style attributes; fonts and images may be data: or blob:
// (VexFlow's bundled music fonts, pdf.js page images); workers are this site's (the service worker).
export function contentSecurityPolicy(nonce: string, dev = false): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "media-src 'self' blob: data:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** Headers every response gets, pages and API alike (also set for static files in next.config.mjs). */
export const BASE_SECURITY_HEADERS: Record<string, string> = {
  "X-Content-Type-Options": "nosniff",
  "X-Frame-Options": "DENY",
  // Invite, share and sign-in addresses carry tokens: never send them to another site.
  "Referrer-Policy": "same-origin",
  "Cross-Origin-Opener-Policy": "same-origin",
  "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=()",
};

export const HSTS = "max-age=31536000; includeSubDomains";
