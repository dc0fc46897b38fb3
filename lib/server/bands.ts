import "server-only";
// Bands: create one (its creator leads it), list mine, read one.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { Role } from "@/lib/band/roles";
import { BandCreateSchema } from "@/lib/validation/band";
import { requireMember, type Actor } from "./access";
import { recordChange } from "./changes";
import { AppError } from "./errors";
import { newId, nowIso } from "./tokens";
import { parseInput } from "./input";

export interface BandDto {
  id: string;
  name: string;
  city: string | null;
  createdAt: string;
  /** The caller's place in the band. */
  role: Role;
  instrument: string;
  expiresAt: string | null;
}

function requireActor(actor: Actor | null): Actor {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  return actor;
}

export async function createBand(db: Kysely<Database>, actor: Actor | null, input: unknown): Promise<BandDto> {
  const me = requireActor(actor);
  const { name, city, instrument } = parseInput(BandCreateSchema, input);
  const now = nowIso();
  const id = newId();
  await db.transaction().execute(async (trx) => {
    await trx.insertInto("bands").values({ id, name, city, created_by: me.userId, created_at: now }).execute();
    await trx
      .insertInto("memberships")
      .values({ band_id: id, user_id: me.userId, role: "leader", instrument, expires_at: null, created_at: now })
      .execute();
    await recordChange(trx, { bandId: id, entity: "band", entityId: id, op: "upsert" });
    await recordChange(trx, { bandId: id, entity: "membership", entityId: me.userId, op: "upsert" });
  });
  return { id, name, city, createdAt: now, role: "leader", instrument, expiresAt: null };
}

export async function listMyBands(db: Kysely<Database>, actor: Actor | null, now = new Date()): Promise<BandDto[]> {
  const me = requireActor(actor);
  const rows = await db
    .selectFrom("memberships as m")
    .innerJoin("bands as b", "b.id", "m.band_id")
    .select(["b.id", "b.name", "b.city", "b.created_at", "m.role", "m.instrument", "m.expires_at"])
    .where("m.user_id", "=", me.userId)
    .where((eb) => eb.or([eb("m.expires_at", "is", null), eb("m.expires_at", ">", now.toISOString())]))
    .orderBy("b.name")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    city: r.city,
    createdAt: r.created_at,
    role: r.role,
    instrument: r.instrument,
    expiresAt: r.expires_at,
  }));
}

export async function getBand(db: Kysely<Database>, actor: Actor | null, bandId: string): Promise<BandDto> {
  const m = await requireMember(db, actor, bandId, "belong");
  const b = await db.selectFrom("bands").selectAll().where("id", "=", bandId).executeTakeFirst();
  if (!b) throw new AppError("not_found", "That band was not found.");
  return { id: b.id, name: b.name, city: b.city, createdAt: b.created_at, role: m.role, instrument: m.instrument, expiresAt: m.expires_at };
}
