// Runs before every page and route: a fresh CSP nonce per request (Next puts it on its own scripts
// when it finds it in the request's Content-Security-Policy header), the security headers, and
// HSTS when the app is served over https.
import { NextResponse, type NextRequest } from "next/server";
import { BASE_SECURITY_HEADERS, contentSecurityPolicy, HSTS } from "@/lib/server/security-headers";

export function proxy(request: NextRequest) {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  const nonce = btoa(String.fromCharCode(...bytes));
  const csp = contentSecurityPolicy(nonce, process.env.NODE_ENV === "development");
  const headers = new Headers(request.headers);
  headers.set("x-nonce", nonce);
  headers.set("content-security-policy", csp);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", csp);
  for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) response.headers.set(name, value);
  const https = request.nextUrl.protocol === "https:" || request.headers.get("x-forwarded-proto") === "https";
  if (https) response.headers.set("Strict-Transport-Security", HSTS);
  return response;
}

export const config = {
  // Not the build's static files and not the service worker script (its own policy would bind the
  // worker); next.config.mjs gives those the base headers.
  matcher: [{ source: "/((?!_next/static|_next/image|sw[^/]*\\.js|favicon\\.ico).*)" }],
};
