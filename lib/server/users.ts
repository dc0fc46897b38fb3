import "server-only";
// Accounts: sign-up with a password, and the look-ups sign-in needs. Passwords are kept only as
// bcrypt hashes.
import bcrypt from "bcryptjs";
import type { Kysely } from "kysely";
import type { Database, User } from "@/db/schema";
import { SignUpSchema } from "@/lib/validation/auth";
import { zodIssues } from "./zod-issues";
import { AppError } from "./errors";
import { newId, nowIso } from "./tokens";

/** bcrypt work factor; tests may lower it through the environment to stay quick. */
function cost(): number {
  const n = Number(process.env.BCRYPT_COST);
  return Number.isInteger(n) && n >= 4 && n <= 15 ? n : 10;
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, cost());
}

export function checkPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  defaultInstrument: string;
}

export function toPublicUser(u: User): PublicUser {
  return { id: u.id, email: u.email, name: u.name, defaultInstrument: u.default_instrument };
}

export async function findUserByEmail(db: Kysely<Database>, email: string): Promise<User | undefined> {
  return db.selectFrom("users").selectAll().where("email", "=", email.trim().toLowerCase()).executeTakeFirst();
}

export async function findUserById(db: Kysely<Database>, id: string): Promise<User | undefined> {
  return db.selectFrom("users").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Validates the body itself so server actions and route handlers share one path. */
export async function signUp(db: Kysely<Database>, input: unknown): Promise<PublicUser> {
  const parsed = SignUpSchema.safeParse(input);
  if (!parsed.success) {
    const fields = zodIssues(parsed.error);
    throw new AppError("unprocessable", fields[0]?.message ?? "Check the form.", { fields });
  }
  const { name, email, password, instrument } = parsed.data;
  const existing = await findUserByEmail(db, email);
  if (existing) {
    throw new AppError("conflict", "There is already an account with that e-mail. Sign in instead.", {
      fields: [{ field: "email", message: "There is already an account with that e-mail" }],
    });
  }
  const user: User = {
    id: newId(),
    email,
    name,
    password_hash: await hashPassword(password),
    default_instrument: instrument,
    created_at: nowIso(),
  };
  try {
    await db.insertInto("users").values(user).execute();
  } catch (err) {
    // Two sign-ups racing for one address: the unique index decides.
    if (String(err).includes("UNIQUE")) throw new AppError("conflict", "There is already an account with that e-mail. Sign in instead.");
    throw err;
  }
  return toPublicUser(user);
}

/** Accounts made from a sign-in link have no password until the person sets one. */
export async function findOrCreateLinkUser(db: Kysely<Database>, email: string): Promise<User> {
  const existing = await findUserByEmail(db, email);
  if (existing) return existing;
  const user: User = {
    id: newId(),
    email: email.toLowerCase(),
    name: email.split("@")[0] ?? email,
    password_hash: null,
    default_instrument: "concert",
    created_at: nowIso(),
  };
  await db.insertInto("users").values(user).onConflict((oc) => oc.column("email").doNothing()).execute();
  return (await findUserByEmail(db, email)) ?? user;
}
