import "server-only";
// Secrets that travel in links (invites, sign-in links). Only their sha256 is stored, so a leaked
// database cannot be turned back into working links.
import { createHash, randomBytes, randomUUID } from "node:crypto";

export function newToken(): string {
  return randomBytes(32).toString("base64url");
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function newId(): string {
  return randomUUID();
}

export function nowIso(now = new Date()): string {
  return now.toISOString();
}

/** The app's public address, for links in e-mail. */
export function appUrl(path = ""): string {
  const base = (process.env.NEXTAUTH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`).replace(/\/+$/, "");
  return `${base}${path}`;
}
