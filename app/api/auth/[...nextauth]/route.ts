import NextAuth from "next-auth";
import { NextRequest } from "next/server";
import { errorResponse } from "@/lib/server/handler";
import { authOptions } from "@/lib/server/auth-options";
import { assertSameSite, readBodyText } from "@/lib/server/request-guard";

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

/** A sign-in form is a few hundred bytes: a bigger body is refused before it is read. */
const AUTH_BODY_BYTES = 16 * 1024;

async function POST(request: NextRequest, context: Ctx): Promise<Response> {
  let text: string;
  try {
    assertSameSite(request);
    text = await readBodyText(request, AUTH_BODY_BYTES);
  } catch (err) {
    return errorResponse(err);
  }
  const again = new NextRequest(request.url, { method: "POST", headers: request.headers, body: text });
  return handler(again, context);
}

export { handler as GET, POST };
