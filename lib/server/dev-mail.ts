import "server-only";
// Who may read the demo's captured mail (app/dev/mail): the holder of the key printed at start sees
// every message; a signed-in person sees only their own; anyone else sees none.
import { timingSafeEqual } from "node:crypto";
import type { Actor } from "./access";

export type MailBoxAccess = { kind: "all" } | { kind: "own"; email: string } | { kind: "none" };

function sameKey(given: string, expected: string): boolean {
  const a = Buffer.from(given);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}

export function mailBoxAccess(key: string | null, actor: Actor | null): MailBoxAccess {
  const expected = process.env.MAIL_VIEW_KEY;
  if (key && expected && expected.length >= 16 && sameKey(key, expected)) return { kind: "all" };
  if (actor) return { kind: "own", email: actor.email.toLowerCase() };
  return { kind: "none" };
}
