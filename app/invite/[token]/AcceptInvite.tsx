"use client";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { acceptInviteAndGo } from "@/app/(auth)/_forms/accept";

export function AcceptInvite({ token, bandId, bandName }: { token: string; bandId: string; bandName: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function accept() {
    setBusy(true);
    setError(await acceptInviteAndGo(token, bandId));
    setBusy(false);
  }
  return (
    <div className="flex flex-col gap-4">
      <div aria-live="assertive">{error ? <Notice kind="error" testId="invite-error">{error}</Notice> : null}</div>
      <Button onClick={accept} disabled={busy} data-testid="accept-invite">
        {busy ? "Joining…" : `Join ${bandName}`}
      </Button>
    </div>
  );
}
