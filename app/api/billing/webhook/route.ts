import { ready } from "@/db";
import { handleWebhook } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";

// Called by the payment provider. The raw body is needed as sent: its signature is checked on it.
export const POST = route({ anonymous: true }, async ({ request }) =>
  handleWebhook(await ready(), await request.text(), request.headers.get("stripe-signature")),
);
