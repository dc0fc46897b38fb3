"use client";
import Link from "next/link";
import { signIn } from "next-auth/react";
import { useSearchParams } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { go, safePath } from "./redirect";

export function SignInForm() {
  const params = useSearchParams();
  const callbackUrl = safePath(params.get("callbackUrl"));
  const [error, setError] = useState<string | null>(params.get("error") && params.get("error") !== "CredentialsSignin" ? params.get("error") : null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    const res = await signIn("password", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
      callbackUrl,
    });
    if (res?.ok && !res.error) return go(callbackUrl);
    setBusy(false);
    setError(res?.error && res.error !== "CredentialsSignin" ? res.error : "That e-mail and password do not match an account.");
  }

  const withCallback = (path: string) => (callbackUrl !== "/bands" ? `${path}?callbackUrl=${encodeURIComponent(callbackUrl)}` : path);

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate data-testid="signin-form">
      <div aria-live="assertive">{error ? <Notice kind="error" testId="signin-error">{error}</Notice> : null}</div>
      <Field label="Email" name="email" type="email" autoComplete="email" required defaultValue={params.get("email") ?? ""} />
      <Field label="Password" name="password" type="password" autoComplete="current-password" required />
      <Button type="submit" disabled={busy}>
        {busy ? "Signing in…" : "Sign in"}
      </Button>
      <p className="text-sm text-ink-muted">
        Forgot it, or never set one?{" "}
        <Link className="font-semibold text-brass-dark underline" href={withCallback("/signin/email-link")}>
          Send me a sign-in link
        </Link>
      </p>
      <p className="text-sm text-ink-muted">
        New here?{" "}
        <Link className="font-semibold text-brass-dark underline" href={withCallback("/signup")}>
          Create an account
        </Link>
      </p>
    </form>
  );
}
