import type { Metadata } from "next";
import { Suspense } from "react";
import { SignInForm } from "../_forms/SignInForm";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  return (
    <>
      <h1 className="mb-6 text-2xl font-bold tracking-tight text-ink">Sign in</h1>
      <Suspense>
        <SignInForm />
      </Suspense>
    </>
  );
}
