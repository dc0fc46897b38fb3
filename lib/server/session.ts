import "server-only";
// The signed-in user for server components, route handlers and server actions.
//
// Verifying a session in full (next-auth decrypting the JWT and running its callbacks) costs more
// than serving a sync page, and a device syncing a big book makes many requests in a row with the
// same cookie. So a verified session is remembered for a while in this process, keyed by the exact
// session cookie text, together with its claims (user id, session version, session id). Every hit
// still asks the database, in one indexed query, whether that session is live: the user exists,
// its session version is unchanged and the session id was not ended. So a session ended in any
// process (sign-out, sign out everywhere, password change, removed membership) is refused by every
// other process on its next request, not some seconds later.
// Band membership and roles are NOT cached here: requireMember checks them on every request.
import { getServerSession } from "next-auth";
import { decode } from "next-auth/jwt";
import { cookies } from "next/headers";
import { ready } from "@/db";
import type { Actor } from "./access";
import { authOptions } from "./auth-options";
import { verifiedSessions, type VerifiedSession } from "./session-cache";
import { isSessionStillLive, type SessionClaims } from "./session-version";

export const SESSION_CACHE_MS = 30_000;
const MAX_ENTRIES = 1_000;
const SESSION_COOKIE = /^(?:__Secure-)?next-auth\.session-token(?:\.(\d+))?$/;

const verified = verifiedSessions;

interface CookieLike {
  name: string;
  value: string;
}

/** The session cookie chunks in order: next-auth splits a large token into `.0`, `.1`, … cookies. */
function sessionChunks(all: CookieLike[]): CookieLike[] {
  return all
    .filter((c) => SESSION_COOKIE.test(c.name))
    .sort((a, b) => Number(SESSION_COOKIE.exec(a.name)![1] ?? -1) - Number(SESSION_COOKIE.exec(b.name)![1] ?? -1));
}

async function verify(): Promise<Actor | null> {
  const session = await getServerSession(authOptions);
  const user = session?.user as { id?: string; email?: string | null; name?: string | null } | undefined;
  if (!user?.id || !user.email) return null;
  return { userId: user.id, email: user.email, name: user.name ?? user.email };
}

/** The claims the token carries (already verified by `verify`), or null when they cannot be read. */
async function claimsOf(chunks: CookieLike[], userId: string): Promise<(SessionClaims & { expiresAt: number }) | null> {
  try {
    const token = await decode({ token: chunks.map((c) => c.value).join(""), secret: authOptions.secret ?? "" });
    if (!token || token.sub !== userId || typeof token.sv !== "number") return null;
    const expiresAt = typeof token.exp === "number" ? token.exp * 1000 : Date.now();
    return { userId, version: token.sv, sid: typeof token.sid === "string" ? token.sid : null, expiresAt };
  } catch {
    return null;
  }
}

function remember(key: string, entry: VerifiedSession): void {
  if (verified.size >= MAX_ENTRIES) verified.clear();
  verified.set(key, entry);
}

export async function getActor(): Promise<Actor | null> {
  const chunks = sessionChunks((await cookies()).getAll());
  if (chunks.length === 0) return null;
  const key = chunks.map((c) => `${c.name}=${c.value}`).join(";");
  const now = Date.now();
  const hit = verified.get(key);
  if (hit && hit.until > now) {
    if (await isSessionStillLive(await ready(), hit.claims)) return { ...hit.actor };
    verified.delete(key);
    return null;
  }
  if (hit) verified.delete(key);
  const actor = await verify();
  if (!actor) return null;
  const claims = await claimsOf(chunks, actor.userId);
  if (claims) remember(key, { actor, claims, until: Math.min(now + SESSION_CACHE_MS, claims.expiresAt) });
  return actor;
}
