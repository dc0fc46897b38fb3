// Real SQLite files in a temp folder (or, under `npm run test:pg`, a fresh PostgreSQL schema),
// migrated like production; actors made directly.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";
import { openTestDatabase } from "@/db/test-database";
import type { Database } from "@/db/schema";
import type { Role } from "@/lib/band/roles";
import type { Actor } from "@/lib/server/access";
import { AppError } from "@/lib/server/errors";

const dirs: string[] = [];

export async function freshDb(): Promise<Kysely<Database>> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-test-"));
  dirs.push(dir);
  return openTestDatabase(path.join(dir, "test.db"));
}

export function cleanupDbs(): void {
  for (const d of dirs.splice(0)) fs.rmSync(d, { recursive: true, force: true });
}

export async function makeUser(db: Kysely<Database>, name: string, email = `${name.toLowerCase()}-${randomUUID().slice(0, 8)}@band.test`): Promise<Actor> {
  const id = randomUUID();
  await db
    .insertInto("users")
    .values({ id, email, name, password_hash: null, default_instrument: "concert", created_at: new Date().toISOString() })
    .execute();
  return { userId: id, email, name };
}

export async function addMember(db: Kysely<Database>, bandId: string, actor: Actor, role: Role, expiresAt: string | null = null): Promise<void> {
  await db
    .insertInto("memberships")
    .values({ band_id: bandId, user_id: actor.userId, role, instrument: "concert", expires_at: expiresAt, created_at: new Date().toISOString() })
    .execute();
}

export interface BandCast {
  bandId: string;
  leader: Actor;
  arranger: Actor;
  player: Actor;
  sub: Actor;
  outsider: Actor;
  expiredSub: Actor;
}

/** A band with one person in each role, an outsider, and a sub whose access has ended. */
export async function makeBand(db: Kysely<Database>): Promise<BandCast> {
  const leader = await makeUser(db, "Leader");
  const bandId = randomUUID();
  await db.insertInto("bands").values({ id: bandId, name: "Test Band", city: null, created_by: leader.userId, created_at: new Date().toISOString() }).execute();
  await addMember(db, bandId, leader, "leader");
  const arranger = await makeUser(db, "Arranger");
  await addMember(db, bandId, arranger, "arranger");
  const player = await makeUser(db, "Player");
  await addMember(db, bandId, player, "player");
  const sub = await makeUser(db, "Sub");
  await addMember(db, bandId, sub, "sub", new Date(Date.now() + 86_400_000).toISOString());
  const expiredSub = await makeUser(db, "Expired");
  await addMember(db, bandId, expiredSub, "sub", new Date(Date.now() - 60_000).toISOString());
  const outsider = await makeUser(db, "Outsider");
  return { bandId, leader, arranger, player, sub, outsider, expiredSub };
}

/** Runs a call and reports "ok" or the HTTP status of the AppError it threw. */
export async function outcome(fn: () => Promise<unknown>): Promise<"ok" | number> {
  try {
    await fn();
    return "ok";
  } catch (err) {
    if (err instanceof AppError) return err.status;
    throw err;
  }
}

export async function appError(fn: () => Promise<unknown>): Promise<AppError> {
  try {
    await fn();
  } catch (err) {
    if (err instanceof AppError) return err;
    throw err;
  }
  throw new Error("expected an AppError, but the call succeeded");
}

export const SIMPLE_CHART = `title: Test Tune
key: C
time: 4/4

A:
| Cmaj7 | Am7 | Dm7 | G7 |
`;

export function chartInput(over: Record<string, unknown> = {}) {
  return { title: "Test Tune", composer: "", key: "C", meter: "4/4", tempo: 120, feel: "swing", sourceText: SIMPLE_CHART, ...over };
}
