import "server-only";
// The signed-in user for server components, route handlers and server actions.
//
// Verifying a session (decrypting the JWT, then looking the user up so a token that outlived its
// account counts as signed out) costs more than serving a sync page. A device syncing a big book
// makes many requests in a row with the same cookie, so a verified actor is kept in memory for a
// few seconds, keyed by the exact session cookie text. Only successful verifications are kept.
// Consequence, by design: a deleted account (or an expired token) is refused at most
// SESSION_CACHE_MS later in another process; a session ended in this process (sign-out, sign out
// everywhere, password change) empties this cache at once.
// Band membership and roles are NOT cached here: requireMember checks them on every request.
import { getServerSession } from "next-auth";
import { cookies } from "next/headers";
import type { Actor } from "./access";
import { authOptions } from "./auth-options";
import { verifiedSessions } from "./session-cache";

export const SESSION_CACHE_MS = 5_000;
const MAX_ENTRIES = 1_000;

const verified = verifiedSessions;

/** The session cookie(s) as one key: next-auth may split a large token into `.0`, `.1`, … chunks. */
async function sessionKey(): Promise<string | null> {
  let key = "";
  for (const c of (await cookies()).getAll()) {
    if (c.name.includes("next-auth.session-token")) key += `${c.name}=${c.value};`;
  }
  return key === "" ? null : key;
}

async function verify(): Promise<Actor | null> {
  const session = await getServerSession(authOptions);
  const user = session?.user as { id?: string; email?: string | null; name?: string | null } | undefined;
  if (!user?.id || !user.email) return null;
  return { userId: user.id, email: user.email, name: user.name ?? user.email };
}

export async function getActor(): Promise<Actor | null> {
  const key = await sessionKey();
  if (key === null) return null;
  const now = Date.now();
  const hit = verified.get(key);
  if (hit && hit.until > now) return { ...hit.actor };
  if (hit) verified.delete(key);
  const actor = await verify();
  if (actor) {
    if (verified.size >= MAX_ENTRIES) verified.clear();
    verified.set(key, { actor, until: now + SESSION_CACHE_MS });
  }
  return actor;
}
