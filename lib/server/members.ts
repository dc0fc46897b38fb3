import "server-only";
// Members of a band: who plays what, roles, leaving. A band always keeps at least one leader.
// Invites live in invites.ts and are re-exported here.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "@/db/schema";
import { rosterRows, type RosterRow } from "@/db/sync-queries";
import type { WireMember } from "@/lib/wire";
import type { Role } from "@/lib/band/roles";
import { MemberUpdateSchema, MyInstrumentSchema } from "@/lib/validation/band";
import { RoleSchema } from "@/lib/band/roles";
import { requireMember, type Actor } from "./access";
import { dropMemberSubscriptions } from "./push-subscriptions";
import { recordChange } from "./changes";
import { AppError } from "./errors";
import { parseInput } from "./input";
import { endAllSessions } from "./session-version";

export { acceptInvite, INVITE_DAYS, inviteMember, listInvites, previewInvite, type InviteDto, type InvitePreview } from "./invites";

/** A roster row in the wire shape the members page and the sync feed share. */
export function toWireMember(r: RosterRow): WireMember {
  return { userId: r.user_id, name: r.name, email: r.email, role: r.role, instrument: r.instrument, expiresAt: r.expires_at };
}

export async function listMembers(db: Kysely<Database>, actor: Actor | null, bandId: string): Promise<WireMember[]> {
  await requireMember(db, actor, bandId, "readBook");
  return listMembersUnchecked(db, bandId);
}

async function targetMembership(trx: Transaction<Database>, bandId: string, userId: string) {
  const m = await trx.selectFrom("memberships").selectAll().where("band_id", "=", bandId).where("user_id", "=", userId).executeTakeFirst();
  if (!m) throw new AppError("not_found", "That person is not in this band.");
  return m;
}

async function assertAnotherLeader(trx: Transaction<Database>, bandId: string, userId: string): Promise<void> {
  const others = await trx
    .selectFrom("memberships")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("band_id", "=", bandId)
    .where("role", "=", "leader")
    .where("expires_at", "is", null)
    .where("user_id", "!=", userId)
    .executeTakeFirstOrThrow();
  if (Number(others.n) === 0) {
    throw new AppError("conflict", "A band needs a leader. Make someone else a leader first.");
  }
}

export async function updateMember(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  userId: string,
  input: unknown,
): Promise<WireMember> {
  await requireMember(db, actor, bandId, "manageMembers");
  const data = parseInput(MemberUpdateSchema, input);
  await db.transaction().execute(async (trx) => {
    const m = await targetMembership(trx, bandId, userId);
    if (m.role === "leader" && data.role && data.role !== "leader") await assertAnotherLeader(trx, bandId, userId);
    const expiresAt = data.expiresAt === undefined ? undefined : data.expiresAt && new Date(data.expiresAt).toISOString();
    // Only a sub's access runs out: an end date on anyone else could leave the band with no leader.
    if (expiresAt && (data.role ?? m.role) !== "sub") {
      throw new AppError("unprocessable", "Only a sub's access can have an end date. Make them a sub first, or leave the end date empty.", {
        fields: [{ field: "expiresAt", message: "Only a sub's access can end" }],
      });
    }
    await trx
      .updateTable("memberships")
      .set({
        ...(data.role ? { role: data.role } : {}),
        ...(data.instrument ? { instrument: data.instrument } : {}),
        ...(expiresAt !== undefined ? { expires_at: expiresAt } : {}),
        // Only a sub's access runs out: promoting a sub clears the end time unless one is sent.
        ...(data.role && data.role !== "sub" && expiresAt === undefined ? { expires_at: null } : {}),
        ...(data.role === "leader" ? { expires_at: null } : {}),
      })
      .where("band_id", "=", bandId)
      .where("user_id", "=", userId)
      .execute();
    await recordChange(trx, { bandId, entity: "membership", entityId: userId, op: "upsert" });
  });
  const all = await listMembersUnchecked(db, bandId);
  const updated = all.find((x) => x.userId === userId);
  if (!updated) throw new AppError("not_found", "That person is not in this band.");
  return updated;
}

export async function changeRole(db: Kysely<Database>, actor: Actor | null, bandId: string, userId: string, role: Role): Promise<WireMember> {
  return updateMember(db, actor, bandId, userId, { role: parseInput(RoleSchema, role) });
}

/** A leader removes anyone; anyone may leave a band themselves. */
export async function removeMember(db: Kysely<Database>, actor: Actor | null, bandId: string, userId: string): Promise<void> {
  const self = actor?.userId === userId;
  await requireMember(db, actor, bandId, self ? "belong" : "manageMembers");
  await db.transaction().execute(async (trx) => {
    const m = await targetMembership(trx, bandId, userId);
    if (m.role === "leader") await assertAnotherLeader(trx, bandId, userId);
    await trx.deleteFrom("memberships").where("band_id", "=", bandId).where("user_id", "=", userId).execute();
    await recordChange(trx, { bandId, entity: "membership", entityId: userId, op: "delete" });
    await dropMemberSubscriptions(trx, bandId, userId);
  });
  // A removed member's open sessions end, so a device left signed in stops syncing at once.
  if (!self) await endAllSessions(db, userId);
}

/** With a band: the part I read in that band. Without: my default for new bands. */
export async function setMyInstrument(db: Kysely<Database>, actor: Actor | null, input: unknown): Promise<{ instrument: string; bandId: string | null }> {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  const data = parseInput(MyInstrumentSchema, input);
  if (data.bandId) {
    const bandId = data.bandId;
    await requireMember(db, actor, bandId, "belong");
    await db.transaction().execute(async (trx) => {
      await trx
        .updateTable("memberships")
        .set({ instrument: data.instrument })
        .where("band_id", "=", bandId)
        .where("user_id", "=", actor.userId)
        .execute();
      await recordChange(trx, { bandId, entity: "membership", entityId: actor.userId, op: "upsert" });
    });
    return { instrument: data.instrument, bandId };
  }
  await db.updateTable("users").set({ default_instrument: data.instrument }).where("id", "=", actor.userId).execute();
  return { instrument: data.instrument, bandId: null };
}

async function listMembersUnchecked(db: Kysely<Database>, bandId: string): Promise<WireMember[]> {
  return (await rosterRows(db, bandId)).map(toWireMember);
}
