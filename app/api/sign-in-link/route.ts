import { route } from "@/lib/server/handler";
import { LIMITS } from "@/lib/server/rate-limit";
import { requestSignInLink } from "@/lib/server/sign-in";
import { SignInLinkRequestSchema } from "@/lib/validation/auth";

// Answers the same whether or not the address has an account.
export const POST = route({ anonymous: true, body: SignInLinkRequestSchema, maxBytes: 8 * 1024, limit: LIMITS.linkPerClient }, async ({ db, body }) => {
  await requestSignInLink(db, body.email, body.callbackUrl);
  return { ok: true, message: `If ${body.email} can receive mail, a sign-in link is on its way.` };
});
