"use client";
// Who is signed in, and the way to end every session of this account at once (a lost phone, a
// tablet left signed in at a venue). Asks inline first; afterwards this device signs out too.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { ConfirmInline } from "@/components/ui/Confirm";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { signOutAndClear } from "@/lib/offline/hooks";
import { readApiError } from "@/lib/api-error";

async function endEverySession(): Promise<string | null> {
  try {
    const res = await fetch("/api/auth/sign-out-everywhere", { method: "POST" });
    if (res.ok) return null;
    return (await readApiError(res, "The other devices were not signed out. Try again.")).message;
  } catch {
    return "No signal: signing out every device needs the server. Try again when you are online.";
  }
}

function SignOutEverywhere() {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function confirm() {
    setBusy(true);
    setError(null);
    const failed = await endEverySession();
    if (failed) {
      setError(failed);
      setBusy(false);
      return;
    }
    // Every session is over, this one included: clear this device's copy and go to sign-in.
    await signOutAndClear().catch(() => router.push("/signin"));
  }

  return (
    <section aria-labelledby="everywhere-title" className="rounded-lg border border-paper-dim bg-white p-4">
      <h2 id="everywhere-title" className="text-lg font-semibold">
        Sign out on every device
      </h2>
      <p className="my-2 text-ink-muted">
        Ends every session of this account: phones, tablets and browsers you signed in on, this one too. Use it when a
        device is lost or was left signed in somewhere.
      </p>
      {asking ? (
        <ConfirmInline
          question="Sign out on every device, this one included?"
          confirmLabel={busy ? "Signing out…" : "Sign out everywhere"}
          cancelLabel="Stay signed in"
          busy={busy}
          onConfirm={confirm}
          onCancel={() => setAsking(false)}
          testId="sign-out-everywhere-confirm"
        />
      ) : (
        <Button tone="danger" onClick={() => setAsking(true)} data-testid="sign-out-everywhere">
          Sign out everywhere…
        </Button>
      )}
      {error ? (
        <Notice kind="error" className="mt-3" testId="sign-out-everywhere-error">
          {error}
        </Notice>
      ) : null}
    </section>
  );
}

export function AccountScreen({ email, name }: { email: string; name: string }) {
  return (
    <PageColumn>
      <Link href="/bands" className="mb-2 inline-block text-sm text-ink-muted underline-offset-4 hover:underline">
        ← Your bands
      </Link>
      <PageTitle lead={`Signed in as ${name} (${email}).`}>Your account</PageTitle>
      <SignOutEverywhere />
    </PageColumn>
  );
}
