import "server-only";
// Invites: a single-use link by e-mail that expires after a week, bound to one band and one
// address. Only the token's hash is stored.
import type { Kysely } from "kysely";
import type { Database, Invite } from "@/db/schema";
import { type Role, accessEnds } from "@/lib/band/roles";
import { inviteMail, sendMail } from "@/lib/mail";
import { InviteCreateSchema } from "@/lib/validation/band";
import { requireMember, type Actor, signedIn } from "./access";
import { assertPlanAllows } from "./billing";
import { recordChange } from "./changes";
import { AppError } from "./errors";
import { parseInput } from "./input";
import { appUrl, hashToken, newId, newToken, nowIso } from "./tokens";

export const INVITE_DAYS = 7;

export interface InviteDto {
  id: string;
  bandId: string;
  email: string;
  role: Role;
  instrument: string;
  expiresAt: string;
  accessExpiresAt: string | null;
  acceptedAt: string | null;
  createdAt: string;
}

function toInviteDto(i: Invite): InviteDto {
  return {
    id: i.id,
    bandId: i.band_id,
    email: i.email,
    role: i.role,
    instrument: i.instrument,
    expiresAt: i.expires_at,
    accessExpiresAt: i.access_expires_at,
    acceptedAt: i.accepted_at,
    createdAt: i.created_at,
  };
}

/** Open invites, for the leader's member screen. */
export async function listInvites(db: Kysely<Database>, actor: Actor | null, bandId: string, now = new Date()): Promise<InviteDto[]> {
  await requireMember(db, actor, bandId, "manageMembers");
  const rows = await db
    .selectFrom("invites")
    .selectAll()
    .where("band_id", "=", bandId)
    .where("accepted_at", "is", null)
    .where("expires_at", ">", now.toISOString())
    .orderBy("created_at", "desc")
    .execute();
  return rows.map(toInviteDto);
}

export async function inviteMember(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  input: unknown,
  now = new Date(),
): Promise<{ invite: InviteDto; link: string; mailed: boolean }> {
  await requireMember(db, actor, bandId, "manageMembers");
  const me = signedIn(actor);
  const data = parseInput(InviteCreateSchema, input);
  if (data.accessExpiresAt && !accessEnds(data.role)) {
    throw new AppError("unprocessable", "Only a sub's access can have an end date.", {
      fields: [{ field: "accessExpiresAt", message: "Only a sub's access can end" }],
    });
  }
  if (data.accessExpiresAt && new Date(data.accessExpiresAt) <= now) {
    throw new AppError("unprocessable", "The access end time must be in the future.", {
      fields: [{ field: "accessExpiresAt", message: "Choose a time in the future" }],
    });
  }
  const already = await db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select("m.user_id")
    .where("m.band_id", "=", bandId)
    .where("u.email", "=", data.email)
    .executeTakeFirst();
  if (already) {
    throw new AppError("conflict", "That person is already in the band. Change their role instead.", {
      fields: [{ field: "email", message: "Already a member" }],
    });
  }
  await assertPlanAllows(db, bandId, "member", now);
  const band = await db.selectFrom("bands").select("name").where("id", "=", bandId).executeTakeFirstOrThrow();
  const token = newToken();
  const invite: Invite = {
    id: newId(),
    band_id: bandId,
    token_hash: hashToken(token),
    email: data.email,
    role: data.role,
    instrument: data.instrument,
    invited_by: me.userId,
    expires_at: new Date(now.getTime() + INVITE_DAYS * 86_400_000).toISOString(),
    access_expires_at: data.accessExpiresAt ? new Date(data.accessExpiresAt).toISOString() : null,
    accepted_at: null,
    created_at: nowIso(now),
  };
  await db.insertInto("invites").values(invite).execute();
  const link = appUrl(`/invite/${token}`);
  let mailed = true;
  try {
    await sendMail(
      inviteMail({
        to: invite.email,
        bandName: band.name,
        inviterName: me.name,
        role: invite.role,
        link,
        expiresAt: invite.expires_at,
        accessExpiresAt: invite.access_expires_at,
      }),
    );
  } catch (err) {
    // The invite stands; the leader can pass the link on by hand.
    console.error("invite mail failed", err);
    mailed = false;
  }
  return { invite: toInviteDto(invite), link, mailed };
}

export interface InvitePreview {
  bandId: string;
  bandName: string;
  email: string;
  role: Role;
  instrument: string;
  state: "open" | "accepted" | "expired";
}

/** What the invite page shows before anyone signs in. Knowing the token is the permission. */
export async function previewInvite(db: Kysely<Database>, token: string, now = new Date()): Promise<InvitePreview | null> {
  const row = await db
    .selectFrom("invites as i")
    .innerJoin("bands as b", "b.id", "i.band_id")
    .select(["i.band_id", "b.name", "i.email", "i.role", "i.instrument", "i.accepted_at", "i.expires_at"])
    .where("i.token_hash", "=", hashToken(token))
    .executeTakeFirst();
  if (!row) return null;
  const state = row.accepted_at ? "accepted" : row.expires_at <= now.toISOString() ? "expired" : "open";
  return { bandId: row.band_id, bandName: row.name, email: row.email, role: row.role, instrument: row.instrument, state };
}

export async function acceptInvite(
  db: Kysely<Database>,
  actor: Actor | null,
  token: string,
  opts: { bandId?: string } = {},
  now = new Date(),
): Promise<{ bandId: string; role: Role }> {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  const invite = await db.selectFrom("invites").selectAll().where("token_hash", "=", hashToken(token)).executeTakeFirst();
  if (!invite || (opts.bandId && invite.band_id !== opts.bandId)) {
    throw new AppError("not_found", "That invite link is not valid. Ask the leader for a new one.");
  }
  if (invite.accepted_at) throw new AppError("gone", "That invite was already used. Ask the leader for a new one.");
  if (invite.expires_at <= now.toISOString()) throw new AppError("gone", "That invite has expired. Ask the leader for a new one.");
  // The link went to one address; whoever holds it must be signed in as that person.
  if (invite.email !== actor.email.toLowerCase()) {
    throw new AppError("forbidden", `This invite was sent to ${invite.email}. Sign in with that address to accept it.`);
  }
  return db.transaction().execute(async (trx) => {
    const claimed = await trx
      .updateTable("invites")
      .set({ accepted_at: nowIso(now) })
      .where("id", "=", invite.id)
      .where("accepted_at", "is", null)
      .executeTakeFirst();
    if (Number(claimed.numUpdatedRows) !== 1) throw new AppError("gone", "That invite was already used. Ask the leader for a new one.");
    const existing = await trx
      .selectFrom("memberships")
      .selectAll()
      .where("band_id", "=", invite.band_id)
      .where("user_id", "=", actor.userId)
      .executeTakeFirst();
    if (existing) {
      // Joining again (an expired sub coming back) refreshes the access; a current member keeps their role.
      const expired = existing.expires_at !== null && existing.expires_at <= now.toISOString();
      if (!expired) return { bandId: invite.band_id, role: existing.role };
      await trx
        .updateTable("memberships")
        .set({ role: invite.role, instrument: invite.instrument, expires_at: invite.access_expires_at })
        .where("band_id", "=", invite.band_id)
        .where("user_id", "=", actor.userId)
        .execute();
    } else {
      await trx
        .insertInto("memberships")
        .values({
          band_id: invite.band_id,
          user_id: actor.userId,
          role: invite.role,
          instrument: invite.instrument,
          expires_at: invite.access_expires_at,
          created_at: nowIso(now),
        })
        .execute();
    }
    await recordChange(trx, { bandId: invite.band_id, entity: "membership", entityId: actor.userId, op: "upsert" });
    return { bandId: invite.band_id, role: invite.role };
  });
}

