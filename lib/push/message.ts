// What a push message says (the encrypted payload), shared by the server that sends it and the
// service worker that reads it. Small on purpose: the worker pulls the real change itself.
import { z } from "zod";

export const PUSH_KINDS = ["chart", "setlist", "part", "nudge"] as const;

export const PushMessageSchema = z.object({
  v: z.literal(1),
  bandId: z.string().min(1).max(64),
  kind: z.enum(PUSH_KINDS),
  /** Charts touched (chart, part), at most a handful; the set list for setlist and nudge. */
  chartIds: z.array(z.string().max(64)).max(20).default([]),
  setlistId: z.string().max(64).nullable().default(null),
  at: z.string().max(40),
});
export type PushMessage = z.infer<typeof PushMessageSchema>;

/** A push the worker cannot read means "sync every band on this device". */
export function readPushMessage(text: string | null | undefined): PushMessage | null {
  if (!text) return null;
  try {
    const r = PushMessageSchema.safeParse(JSON.parse(text));
    return r.success ? r.data : null;
  } catch {
    return null;
  }
}
