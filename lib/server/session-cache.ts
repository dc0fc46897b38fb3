import "server-only";
// The verified-session cache of session.ts, apart so that ending a session can empty it without
// importing next-auth (and so tests that replace session.ts keep it).
import type { Actor } from "./access";
import type { SessionClaims } from "./session-version";

export interface VerifiedSession {
  actor: Actor;
  claims: SessionClaims;
  until: number;
}

export const verifiedSessions = new Map<string, VerifiedSession>();

/** Drops every remembered verification, after a session was ended in this process. */
export function forgetVerifiedSessions(): void {
  verifiedSessions.clear();
}
