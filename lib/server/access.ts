import "server-only";
// Resolves the acting user's membership in a band and checks it against a permission.
// Outsiders (and subs whose access has ended) get 404 so the band's existence is not revealed.
import type { Kysely } from "kysely";
import type { Database, Membership } from "@/db/schema";
import { membershipRow } from "@/db/sync-queries";
import { AppError } from "./errors";
import { can, describePermission, type Permission } from "@/lib/band/roles";

export interface Actor {
  userId: string;
  email: string;
  name: string;
}

/** The signed-in user, or 401: how a use case narrows its actor after the access check, without a cast. */
export function signedIn(actor: Actor | null): Actor {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  return actor;
}

export async function findMembership(db: Kysely<Database>, userId: string, bandId: string, now = new Date()): Promise<Membership | null> {
  // Asked on every request, so a prepared statement rather than a built query.
  const [m] = await membershipRow(db, bandId, userId);
  if (!m) return null;
  if (m.expires_at && m.expires_at <= now.toISOString()) return null;
  return m;
}

export async function requireMember(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  permission: Permission,
): Promise<Membership> {
  const m = await findMembership(db, signedIn(actor).userId, bandId);
  if (!m) throw new AppError("not_found", "That band was not found.");
  return assertMay(m, permission);
}

/** Checks an already-resolved membership against a permission: the one wording of a refusal. */
export function assertMay(m: Membership, permission: Permission): Membership {
  if (!can(m.role, permission)) {
    throw new AppError("forbidden", `This needs ${describePermission(permission)}; you are a ${m.role} in this band.`);
  }
  return m;
}
