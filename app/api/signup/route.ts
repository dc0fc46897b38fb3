import { NextResponse } from "next/server";
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { signUp } from "@/lib/server/users";
import { SignUpSchema } from "@/lib/validation/auth";

export const POST = route({ anonymous: true, body: SignUpSchema }, async ({ body }) =>
  NextResponse.json({ user: await signUp(await ready(), body) }, { status: 201 }),
);
