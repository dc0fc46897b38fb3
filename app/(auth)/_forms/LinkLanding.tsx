"use client";
import Link from "next/link";
import { signIn } from "next-auth/react";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { go, safePath } from "./redirect";

// A button rather than an automatic sign-in: mail scanners open links, and the token works only once.
export function LinkLanding() {
  const params = useSearchParams();
  const token = params.get("token") ?? "";
  const callbackUrl = safePath(params.get("callbackUrl"));
  const [error, setError] = useState<string | null>(token ? null : "This address has no sign-in token. Ask for a new link.");
  const [busy, setBusy] = useState(false);

  async function finish() {
    setBusy(true);
    setError(null);
    const res = await signIn("link", { token, redirect: false });
    if (res?.ok && !res.error) return go(callbackUrl);
    setBusy(false);
    setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "That sign-in link did not work. Ask for a new one.");
  }

  return (
    <div className="flex flex-col gap-4">
      <div aria-live="assertive">{error ? <Notice kind="error" testId="link-error">{error}</Notice> : null}</div>
      <Button onClick={finish} disabled={busy || !token} data-testid="finish-sign-in">
        {busy ? "Signing in…" : "Finish signing in"}
      </Button>
      <p className="text-sm text-ink-muted">
        <Link className="font-semibold text-brass-dark underline" href="/signin/email-link">
          Send me a new link
        </Link>
      </p>
    </div>
  );
}
