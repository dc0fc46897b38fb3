import "server-only";
// Fanning a published change out to the devices of every member whose book it touches, as small
// encrypted Web Push messages (web-push encrypts and signs: RFC 8291 aes128gcm, RFC 8292 VAPID; the request
// itself goes out through fetch, which also reaches the local fake over plain http). The author's own devices are
// skipped. A burst of edits shares one Topic per band and kind, so a push service holding messages
// for a sleeping phone keeps only the newest; the worker then shows one notification for all of it.
import { createHash } from "node:crypto";
import type { Kysely } from "kysely";
import webpush from "web-push";
import type { Database } from "@/db/schema";
import type { PushMessage } from "@/lib/push/message";
import { activeShareUsers, sharedChartIds } from "./shares";
import { vapidKeys, vapidSubject } from "./push-keys";
import { dropEndpoint } from "./push-subscriptions";
import { can } from "@/lib/band/roles";

export interface BandChange {
  bandId: string;
  /** Who published it; their devices are not told. */
  authorId: string | null;
  kind: PushMessage["kind"];
  chartIds?: string[];
  setlistId?: string | null;
  /** Only these members (a nudge); default: everyone the change touches. */
  onlyUsers?: string[];
}

export interface FanOutResult {
  sent: number;
  removed: number;
  failed: number;
}

/** Twelve hours: a phone asleep through the afternoon still hears about it before the gig. */
const TTL_SECONDS = 12 * 3600;
const PARALLEL = 16;

/** Members who read what the change touches: every non-sub, and subs whose live shares include it. */
async function recipients(db: Kysely<Database>, c: BandChange, now: Date): Promise<Set<string>> {
  const members = await db.selectFrom("memberships").select(["user_id", "role", "expires_at"]).where("band_id", "=", c.bandId).execute();
  const out = new Set<string>();
  const chartIds = new Set(c.chartIds ?? []);
  const listUsers = c.setlistId ? new Set(await activeShareUsers(db, c.setlistId, now)) : new Set<string>();
  for (const m of members) {
    if (m.expires_at && m.expires_at <= now.toISOString()) continue;
    if (can(m.role, "readBook")) out.add(m.user_id);
    else if (listUsers.has(m.user_id)) out.add(m.user_id);
    else if (chartIds.size > 0 && (await sharedChartIds(db, c.bandId, m.user_id, now)).some((id) => chartIds.has(id))) out.add(m.user_id);
  }
  if (c.authorId) out.delete(c.authorId);
  if (c.onlyUsers) for (const u of [...out]) if (!c.onlyUsers.includes(u)) out.delete(u);
  return out;
}

/** RFC 8030 Topic: at most 32 base64url characters, one per band and kind. */
export function pushTopic(bandId: string, kind: string): string {
  return createHash("sha256").update(`${bandId}:${kind === "part" ? "chart" : kind}`).digest("base64url").slice(0, 32);
}

type SendOptions = webpush.RequestOptions & { timeout: number };

/** One encrypted request to one device's push service; the HTTP status (0 when it could not be reached). */
async function send(s: { endpoint: string; p256dh: string; auth: string }, payload: string, options: SendOptions): Promise<number> {
  const req = webpush.generateRequestDetails({ endpoint: s.endpoint, keys: { p256dh: s.p256dh, auth: s.auth } }, payload, options);
  try {
    const res = await fetch(req.endpoint, {
      method: "POST",
      headers: req.headers as Record<string, string>,
      body: req.body ? new Uint8Array(req.body) : null,
      signal: AbortSignal.timeout(options.timeout),
      redirect: "error",
    });
    await res.arrayBuffer().catch(() => undefined);
    return res.status;
  } catch (err) {
    console.warn(`push service unreachable: ${(err as Error).message}`);
    return 0;
  }
}

export async function fanOut(db: Kysely<Database>, c: BandChange, now = new Date()): Promise<FanOutResult> {
  const users = await recipients(db, c, now);
  const result: FanOutResult = { sent: 0, removed: 0, failed: 0 };
  if (users.size === 0) return result;
  const subs = await db.selectFrom("push_subscriptions").selectAll().where("band_id", "=", c.bandId).where("user_id", "in", [...users]).execute();
  if (subs.length === 0) return result;
  const keys = await vapidKeys(db);
  const message: PushMessage = { v: 1, bandId: c.bandId, kind: c.kind, chartIds: (c.chartIds ?? []).slice(0, 20), setlistId: c.setlistId ?? null, at: now.toISOString() };
  const payload = JSON.stringify(message);
  const options: SendOptions = {
    vapidDetails: { subject: vapidSubject(), publicKey: keys.publicKey, privateKey: keys.privateKey },
    TTL: TTL_SECONDS,
    urgency: c.kind === "nudge" ? "high" : "normal",
    topic: pushTopic(c.bandId, c.kind),
    timeout: 10_000,
  };
  const sentIds: string[] = [];
  for (let i = 0; i < subs.length; i += PARALLEL) {
    await Promise.all(
      subs.slice(i, i + PARALLEL).map(async (s) => {
        const status = await send(s, payload, options);
        if (status >= 200 && status < 300) {
          result.sent++;
          sentIds.push(s.id);
        } else if (status === 404 || status === 410) {
          await dropEndpoint(db, s.endpoint);
          result.removed++;
        } else {
          result.failed++;
          console.warn(`push to a device of band ${c.bandId} failed with status ${status}`);
        }
      }),
    );
  }
  if (sentIds.length) await db.updateTable("push_subscriptions").set({ last_sent_at: now.toISOString() }).where("id", "in", sentIds).execute();
  return result;
}
