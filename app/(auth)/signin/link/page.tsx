import type { Metadata } from "next";
import { Suspense } from "react";
import { LinkLanding } from "../../_forms/LinkLanding";

export const metadata: Metadata = { title: "Finish signing in" };

export default function LinkLandingPage() {
  return (
    <>
      <h1 className="mb-2 text-2xl font-bold tracking-tight text-ink">Finish signing in</h1>
      <p className="mb-6 text-ink-muted">Your link is ready. It works once.</p>
      <Suspense>
        <LinkLanding />
      </Suspense>
    </>
  );
}
