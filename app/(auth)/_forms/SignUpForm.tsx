"use client";
import Link from "next/link";
import { signIn } from "next-auth/react";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/Button";
import { Field, SelectField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { INSTRUMENT_OPTIONS } from "@/components/ui/labels";
import { PASSWORD_MIN } from "@/lib/validation/auth";
import { acceptInviteAndGo } from "./accept";
import { go, readFailure, safePath } from "./redirect";

export function SignUpForm({
  callbackUrl,
  email,
  inviteToken,
  inviteBandId,
  instrument = "concert",
}: {
  callbackUrl?: string | null;
  /** Fixed when the form comes from an invite sent to this address. */
  email?: string;
  inviteToken?: string;
  inviteBandId?: string;
  /** The part to suggest (an invite names one). */
  instrument?: string;
}) {
  const next = safePath(callbackUrl);
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const body = {
      name: String(form.get("name") ?? ""),
      email: email ?? String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      instrument: String(form.get("instrument") ?? "concert"),
    };
    setBusy(true);
    setError(null);
    setFields({});
    const res = await fetch("/api/signup", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
    if (!res.ok) {
      const f = await readFailure(res);
      setBusy(false);
      setError(f.message);
      setFields(f.fields);
      return;
    }
    const signedIn = await signIn("password", { email: body.email, password: body.password, redirect: false });
    if (!signedIn?.ok || signedIn.error) {
      // Sign-up answers the same for an address that already has an account; its owner got a mail.
      setBusy(false);
      setError(`Signing in did not work. If ${body.email} already had an account, a sign-in link is on its way to it: open it to get in.`);
      return;
    }
    if (inviteToken) {
      const failure = await acceptInviteAndGo(inviteToken, inviteBandId);
      setBusy(false);
      setError(failure);
      return;
    }
    go(next);
  }

  const signInHref = `/signin${next !== "/bands" ? `?callbackUrl=${encodeURIComponent(next)}` : ""}`;

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate data-testid="signup-form">
      <div aria-live="assertive">{error ? <Notice kind="error" testId="signup-error">{error}</Notice> : null}</div>
      <Field label="Name" name="name" autoComplete="name" required maxLength={100} error={fields.name} />
      {email ? (
        <Field label="Email" name="email" type="email" value={email} readOnly hint="The address the invite was sent to." error={fields.email} />
      ) : (
        <Field label="Email" name="email" type="email" autoComplete="email" required error={fields.email} />
      )}
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN}
        hint={`At least ${PASSWORD_MIN} characters.`}
        error={fields.password}
      />
      <SelectField label="I read" name="instrument" options={INSTRUMENT_OPTIONS} defaultValue={instrument} error={fields.instrument} />
      <Button type="submit" disabled={busy}>
        {busy ? "Creating your account…" : inviteToken ? "Create my account and join" : "Create my account"}
      </Button>
      <p className="text-sm text-ink-muted">
        Already have an account?{" "}
        <Link className="font-semibold text-brass-dark underline" href={signInHref}>
          Sign in
        </Link>
      </p>
    </form>
  );
}
