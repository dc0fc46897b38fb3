"use client";
// The signed-in sub takes the share: one press attaches it to their account (a button, not an
// automatic step, because mail scanners open links), then the set list opens and syncs to the device.
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { apiErrorOf } from "@/lib/api-error";

export function ShareLanding({ token, signedInAs, sentTo }: { token: string; signedInAs: string; sentTo: string }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const wrongPerson = signedInAs.toLowerCase() !== sentTo.toLowerCase();

  async function accept() {
    setBusy(true);
    setError(null);
    try {
      const res = await fetch(`/api/shares/${encodeURIComponent(token)}/accept`, { method: "POST" });
      const body = (await res.json().catch(() => null)) as { bandId?: string; setlistId?: string } | null;
      if (!res.ok || !body?.bandId || !body.setlistId) {
        setError(apiErrorOf(body, "The share could not be opened.").message);
        setBusy(false);
        return;
      }
      // A full load, so the band's shell starts syncing the set list onto this device.
      // eslint-disable-next-line @next/next/no-location-assign-relative-destination
      window.location.assign(`/bands/${encodeURIComponent(body.bandId)}/setlists/${encodeURIComponent(body.setlistId)}`);
    } catch {
      setError("No signal. Opening a share needs the network once; try again when you are online.");
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-3">
      {wrongPerson ? (
        <Notice kind="error" title="Signed in as someone else">
          You are signed in as {signedInAs}, but this set list was shared with {sentTo}. Sign out and sign in with that address.
        </Notice>
      ) : null}
      <Button onClick={accept} disabled={busy || wrongPerson} data-testid="share-accept">
        {busy ? "Opening…" : "Open the set list"}
      </Button>
      <div aria-live="assertive">{error ? <Notice kind="error" testId="share-error">{error}</Notice> : null}</div>
    </div>
  );
}
