import type { Metadata } from "next";
import { SignUpForm } from "../_forms/SignUpForm";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const callbackUrl = typeof sp.callbackUrl === "string" ? sp.callbackUrl : null;
  return (
    <>
      <h1 className="mb-2 text-2xl font-bold tracking-tight text-ink">Create an account</h1>
      <p className="mb-6 text-ink-muted">Then start a band of your own, or open the invite a leader sent you.</p>
      <SignUpForm callbackUrl={callbackUrl} />
    </>
  );
}
