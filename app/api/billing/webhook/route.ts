import { handleWebhook } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { LIMITS } from "@/lib/server/rate-limit";

// Called by the payment provider. The raw body is needed as sent: its signature is checked on it.
// An event is a few KB; 256 KB leaves room and refuses a flood before it is read.
export const POST = route({ anonymous: true, maxBytes: 256 * 1024, limit: LIMITS.anonymousPerClient }, async ({ db, request, text }) =>
  handleWebhook(db, text, request.headers.get("stripe-signature")),
);
