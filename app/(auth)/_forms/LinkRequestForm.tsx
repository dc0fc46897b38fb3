"use client";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { readFailure } from "./redirect";

export function LinkRequestForm({ callbackUrl, mailPage }: { callbackUrl: string | null; mailPage: boolean }) {
  const [sent, setSent] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const email = String(new FormData(e.currentTarget).get("email") ?? "");
    setBusy(true);
    setError(null);
    setFieldError(undefined);
    const res = await fetch("/api/sign-in-link", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(callbackUrl ? { email, callbackUrl } : { email }),
    });
    setBusy(false);
    if (res.ok) {
      setSent(email);
      return;
    }
    const f = await readFailure(res);
    setError(f.message);
    setFieldError(f.fields.email);
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate data-testid="link-request-form">
      <div aria-live="polite">
        {sent ? (
          <Notice kind="success" title="Check your mail" testId="link-sent">
            If {sent} can receive mail, a sign-in link is on its way. It works once, for 15 minutes.
            {mailPage ? (
              <>
                {" "}
                This is a demo: the mail is caught on the captured-mail page whose address (with its key) was printed in the terminal when Pedalpoint started.
              </>
            ) : null}
          </Notice>
        ) : null}
        {error ? <Notice kind="error">{error}</Notice> : null}
      </div>
      <Field label="Email" name="email" type="email" autoComplete="email" required error={fieldError} />
      <Button type="submit" disabled={busy}>
        {busy ? "Sending…" : "Send me a sign-in link"}
      </Button>
    </form>
  );
}
