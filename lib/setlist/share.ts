// Shares: one set list lent to a sub by e-mail until an end time. Pure rules; the server keeps the rows.
import { z } from "zod";
import { EmailSchema, IsoDateTimeSchema } from "@/lib/validation/common";

/** The longest a share may run; a sub is booked for a gig, not for a season. */
export const SHARE_MAX_DAYS = 62;

export const ShareCreateSchema = z
  .object({
    email: EmailSchema,
    expiresAt: IsoDateTimeSchema,
    /** A line from the leader in the e-mail ("Downbeat 9pm, black clothes"). */
    message: z.string().trim().max(500, "Keep the message under 500 characters").default(""),
  })
  .strict();
export type ShareCreate = z.infer<typeof ShareCreateSchema>;

export const SHARE_STATES = ["waiting", "accepted", "ended", "revoked"] as const;
export type ShareState = (typeof SHARE_STATES)[number];

/** A share as the server sends it to the leader's screen: the one wire shape of a share. */
export const WireShareSchema = z.object({
  id: z.string(),
  setlistId: z.string(),
  email: z.string(),
  expiresAt: z.string(),
  state: z.enum(SHARE_STATES),
  createdAt: z.string(),
});
export type WireShare = z.infer<typeof WireShareSchema>;

export interface ShareLike {
  user_id: string | null;
  expires_at: string;
  revoked_at: string | null;
}

export function shareState(share: ShareLike, now = new Date()): ShareState {
  if (share.revoked_at) return "revoked";
  if (share.expires_at <= now.toISOString()) return "ended";
  return share.user_id ? "accepted" : "waiting";
}

/** Refuses an end time in the past or too far ahead; returns the reason, or null when fine. */
export function checkShareEnd(expiresAt: string, now = new Date()): string | null {
  const t = Date.parse(expiresAt);
  if (Number.isNaN(t)) return "Use an ISO date-time like 2026-12-31T23:00:00Z";
  if (t <= now.getTime()) return "The share must end in the future.";
  if (t - now.getTime() > SHARE_MAX_DAYS * 86_400_000) return `A share can run for ${SHARE_MAX_DAYS} days at most.`;
  return null;
}

/** Shown wherever a chart is shared outside the band. */
export const SHARING_CAUTION =
  "Share only charts you have the right to share. Arrangements and lead sheets of published tunes are usually covered by copyright; follow your local rules and the licences you hold.";
