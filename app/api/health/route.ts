import { NextResponse } from "next/server";
import { ready } from "@/db";

export const dynamic = "force-dynamic";

export async function GET(): Promise<Response> {
  try {
    await ready();
    return NextResponse.json({ ok: true });
  } catch (err) {
    console.error(err);
    return NextResponse.json({ ok: false }, { status: 503 });
  }
}
