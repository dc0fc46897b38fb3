import { NextResponse } from "next/server";
import { route } from "@/lib/server/handler";
import { LIMITS } from "@/lib/server/rate-limit";
import { mailAccountExists } from "@/lib/server/sign-in";
import { signUp } from "@/lib/server/users";
import { SignUpSchema } from "@/lib/validation/auth";

// Same answer for a new address and one that has an account (its owner gets a mail instead).
export const POST = route({ anonymous: true, body: SignUpSchema, maxBytes: 8 * 1024, limit: LIMITS.signUpPerClient }, async ({ db, body }) => {
  return NextResponse.json(await signUp(db, body, (email) => mailAccountExists(db, email)), { status: 201 });
});
