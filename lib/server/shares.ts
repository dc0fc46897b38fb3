import "server-only";
// Shares: the leader lends one set list to a sub by e-mail until an end time. The link carries a
// token (only its hash is stored) that works for one person; accepting it makes that person a sub of
// the band until the share ends, if they are not a member already.
import type { Kysely, Transaction } from "kysely";
import type { Database, ShareRow } from "@/db/schema";
import { sendMail } from "@/lib/mail";
import { checkShareEnd, shareMail, ShareCreateSchema, shareState, type ShareState, type WireShare } from "@/lib/setlist";
import { findMembership, requireMember, type Actor, signedIn } from "./access";
import { recordChange } from "./changes";
import { AppError, notFound } from "./errors";
import { parseInput } from "./input";
import { appUrl, hashToken, newId, newToken, nowIso } from "./tokens";
import { can } from "@/lib/band/roles";

type Db = Kysely<Database> | Transaction<Database>;

function toWire(s: ShareRow, now: Date): WireShare {
  return { id: s.id, setlistId: s.setlist_id, email: s.email, expiresAt: s.expires_at, state: shareState(s, now), createdAt: s.created_at };
}

/** Set lists shared with this user in this band right now (accepted, not ended, not withdrawn, not deleted). */
export async function sharedSetlistIds(db: Db, bandId: string, userId: string, now = new Date()): Promise<string[]> {
  const rows = await db
    .selectFrom("shares as s")
    .innerJoin("setlists as l", "l.id", "s.setlist_id")
    .select("s.setlist_id")
    .where("s.band_id", "=", bandId)
    .where("s.user_id", "=", userId)
    .where("s.revoked_at", "is", null)
    .where("s.expires_at", ">", now.toISOString())
    .where("l.deleted_at", "is", null)
    .execute();
  return [...new Set(rows.map((r) => r.setlist_id))];
}

/** Charts a sub may read: those on the set lists shared with them. */
export async function sharedChartIds(db: Db, bandId: string, userId: string, now = new Date()): Promise<string[]> {
  const setlists = await sharedSetlistIds(db, bandId, userId, now);
  if (setlists.length === 0) return [];
  const rows = await db.selectFrom("setlist_entries").select("chart_id").where("setlist_id", "in", setlists).execute();
  return [...new Set(rows.map((r) => r.chart_id))];
}

/** Users currently holding an accepted share of this set list. */
export async function activeShareUsers(db: Db, setlistId: string, now = new Date()): Promise<string[]> {
  const rows = await db
    .selectFrom("shares")
    .select("user_id")
    .where("setlist_id", "=", setlistId)
    .where("user_id", "is not", null)
    .where("revoked_at", "is", null)
    .where("expires_at", ">", now.toISOString())
    .execute();
  return [...new Set(rows.flatMap((r) => (r.user_id ? [r.user_id] : [])))];
}

export async function listShares(db: Kysely<Database>, actor: Actor | null, bandId: string, setlistId: string, now = new Date()): Promise<WireShare[]> {
  await requireMember(db, actor, bandId, "shareWithSubs");
  const rows = await db
    .selectFrom("shares")
    .selectAll()
    .where("band_id", "=", bandId)
    .where("setlist_id", "=", setlistId)
    .orderBy("created_at", "desc")
    .execute();
  return rows.map((r) => toWire(r, now));
}

export async function createShare(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  setlistId: string,
  input: unknown,
  now = new Date(),
): Promise<{ share: WireShare; link: string; mailed: boolean }> {
  await requireMember(db, actor, bandId, "shareWithSubs");
  const me = signedIn(actor);
  const data = parseInput(ShareCreateSchema, input);
  const bad = checkShareEnd(data.expiresAt, now);
  if (bad) throw new AppError("unprocessable", bad, { fields: [{ field: "expiresAt", message: bad }] });
  const setlist = await db
    .selectFrom("setlists")
    .selectAll()
    .where("id", "=", setlistId)
    .where("band_id", "=", bandId)
    .where("deleted_at", "is", null)
    .executeTakeFirst();
  if (!setlist) throw notFound("That set list");
  const band = await db.selectFrom("bands").select("name").where("id", "=", bandId).executeTakeFirstOrThrow();
  const token = newToken();
  const row: ShareRow = {
    id: newId(),
    band_id: bandId,
    setlist_id: setlistId,
    user_id: null,
    email: data.email,
    token_hash: hashToken(token),
    expires_at: new Date(data.expiresAt).toISOString(),
    created_by: me.userId,
    created_at: nowIso(now),
    revoked_at: null,
  };
  await db.insertInto("shares").values(row).execute();
  const link = appUrl(`/share/${token}`);
  let mailed = true;
  try {
    await sendMail(
      shareMail({
        to: row.email,
        bandName: band.name,
        leaderName: me.name,
        setlistName: setlist.name,
        startsAt: setlist.starts_at,
        venue: setlist.venue,
        expiresAt: row.expires_at,
        message: data.message,
        link,
      }),
    );
  } catch (err) {
    // The share stands; the leader can pass the link on by hand.
    console.error("share mail failed", err);
    mailed = false;
  }
  return { share: toWire(row, now), link, mailed };
}

/** Withdraws a share at once; the sub's devices drop the set list at their next sync. */
export async function revokeShare(db: Kysely<Database>, actor: Actor | null, bandId: string, shareId: string, now = new Date()): Promise<WireShare> {
  await requireMember(db, actor, bandId, "shareWithSubs");
  return db.transaction().execute(async (trx) => {
    const share = await trx.selectFrom("shares").selectAll().where("id", "=", shareId).where("band_id", "=", bandId).executeTakeFirst();
    if (!share) throw notFound("That share");
    if (!share.revoked_at) {
      await trx.updateTable("shares").set({ revoked_at: nowIso(now) }).where("id", "=", shareId).execute();
      await recordChange(trx, { bandId, entity: "share", entityId: shareId, op: "delete", userId: share.user_id });
      if (share.user_id) await recordChange(trx, { bandId, entity: "setlist", entityId: share.setlist_id, op: "delete", userId: share.user_id });
    }
    return toWire({ ...share, revoked_at: share.revoked_at ?? nowIso(now) }, now);
  });
}

export interface SharePreview {
  bandName: string;
  setlistName: string;
  email: string;
  expiresAt: string;
  state: ShareState;
}

/** What the share landing page shows before anyone signs in. Knowing the token is the permission. */
export async function previewShare(db: Kysely<Database>, token: string, now = new Date()): Promise<SharePreview | null> {
  const row = await db
    .selectFrom("shares as s")
    .innerJoin("bands as b", "b.id", "s.band_id")
    .innerJoin("setlists as l", "l.id", "s.setlist_id")
    .select(["b.name as bandName", "l.name as setlistName", "l.deleted_at", "s.email", "s.expires_at", "s.user_id", "s.revoked_at"])
    .where("s.token_hash", "=", hashToken(token))
    .executeTakeFirst();
  if (!row) return null;
  const state = row.deleted_at ? "revoked" : shareState(row, now);
  return { bandName: row.bandName, setlistName: row.setlistName, email: row.email, expiresAt: row.expires_at, state };
}

/** Attaches the share to the signed-in person; makes them a sub until the share ends if they are not in the band. */
export async function acceptShare(
  db: Kysely<Database>,
  actor: Actor | null,
  token: string,
  now = new Date(),
): Promise<{ bandId: string; setlistId: string }> {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  const share = await db.selectFrom("shares").selectAll().where("token_hash", "=", hashToken(token)).executeTakeFirst();
  if (!share) throw new AppError("not_found", "That share link is not valid. Ask the leader to send it again.");
  const result = { bandId: share.band_id, setlistId: share.setlist_id };
  const state = shareState(share, now);
  if (state === "revoked") throw new AppError("gone", "The leader withdrew this share.");
  if (state === "ended") throw new AppError("gone", "This share has ended. Ask the leader for a new one.");
  if (share.user_id && share.user_id !== actor.userId) {
    throw new AppError("gone", "This share link was already used by someone else. Ask the leader to send you your own.");
  }
  if (share.user_id === actor.userId) return result;
  // The link went to one address; whoever holds it must be signed in as that person.
  if (share.email !== actor.email.toLowerCase()) {
    throw new AppError("forbidden", `This set list was shared with ${share.email}. Sign in with that address to open it.`);
  }
  await db.transaction().execute(async (trx) => {
    const claimed = await trx
      .updateTable("shares")
      .set({ user_id: actor.userId })
      .where("id", "=", share.id)
      .where("user_id", "is", null)
      .executeTakeFirst();
    if (Number(claimed.numUpdatedRows) !== 1) throw new AppError("gone", "This share link was already used. Ask the leader to send it again.");
    await attachSub(trx, share, actor.userId, now);
    await recordChange(trx, { bandId: share.band_id, entity: "share", entityId: share.id, op: "upsert", userId: actor.userId });
    // The set list and its charts may be older than the sub's cursor: deliver them on the private feed.
    await recordChange(trx, { bandId: share.band_id, entity: "setlist", entityId: share.setlist_id, op: "upsert", userId: actor.userId });
    const charts = await trx.selectFrom("setlist_entries").select("chart_id").where("setlist_id", "=", share.setlist_id).execute();
    for (const chartId of new Set(charts.map((c) => c.chart_id))) {
      await recordChange(trx, { bandId: share.band_id, entity: "chart", entityId: chartId, op: "upsert", userId: actor.userId });
    }
  });
  return result;
}

async function attachSub(trx: Transaction<Database>, share: ShareRow, userId: string, now: Date): Promise<void> {
  const existing = await trx
    .selectFrom("memberships")
    .selectAll()
    .where("band_id", "=", share.band_id)
    .where("user_id", "=", userId)
    .executeTakeFirst();
  const active = existing ? await findMembership(trx, userId, share.band_id, now) : null;
  if (active && can(active.role, "readBook")) return; // a member already reads the whole book
  // A sub whose access already runs longer keeps it.
  if (active && (active.expires_at === null || active.expires_at >= share.expires_at)) return;
  if (existing) {
    await trx
      .updateTable("memberships")
      .set({ role: "sub", expires_at: share.expires_at })
      .where("band_id", "=", share.band_id)
      .where("user_id", "=", userId)
      .execute();
  } else {
    const user = await trx.selectFrom("users").select("default_instrument").where("id", "=", userId).executeTakeFirst();
    await trx
      .insertInto("memberships")
      .values({
        band_id: share.band_id,
        user_id: userId,
        role: "sub",
        instrument: user?.default_instrument ?? "concert",
        expires_at: share.expires_at,
        created_at: nowIso(now),
      })
      .execute();
  }
  await recordChange(trx, { bandId: share.band_id, entity: "membership", entityId: userId, op: "upsert" });
}
