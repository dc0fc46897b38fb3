import type { Metadata } from "next";
import Link from "next/link";
import { ShareLanding } from "@/components/setlist/ShareLanding";
import { LinkButton } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { ready } from "@/db";
import { getActor } from "@/lib/server/session";
import { previewShare } from "@/lib/server/shares";
import { utcText } from "@/lib/mail/html";
import { SHARING_CAUTION } from "@/lib/setlist";
import { TokenParams } from "@/lib/validation/params";

export const metadata: Metadata = { title: "A set list for you" };

const ENDED: Record<string, string> = {
  ended: "This share has ended. Ask the leader for a new one.",
  revoked: "The leader withdrew this share.",
};

// The sub's landing from the e-mailed link: sign in or make an account, then the set list is theirs
// until the share ends. Needs the network; from then on the set list lives on the device.
export default async function SharePage({ params }: { params: Promise<{ token: string }> }) {
  const parsed = TokenParams.safeParse(await params);
  const db = await ready();
  const share = parsed.success ? await previewShare(db, parsed.data.token) : null;
  const actor = await getActor();
  const here = parsed.success ? `/share/${parsed.data.token}` : "/";
  const when = share ? utcText(share.expiresAt) : "";

  return (
    <div className="flex min-h-screen flex-col bg-paper">
      <header className="px-4 py-4 sm:px-6">
        <Link href="/" className="text-lg font-bold tracking-tight text-ink">Pedalpoint</Link>
      </header>
      <main id="main" className="mx-auto flex w-full max-w-md flex-1 flex-col gap-4 px-4 pb-16 pt-4 sm:px-6">
        {!share ? (
          <Notice kind="error" title="This link does not work">It may be mistyped. Ask the leader to send it again.</Notice>
        ) : (
          <>
            <h1 className="text-2xl font-bold tracking-tight text-ink" data-testid="share-title">{share.setlistName}</h1>
            <p className="text-ink-muted">
              {share.bandName} shared this set list with {share.email}. You can read it and its charts, offline too, until {when}.
            </p>
            {ENDED[share.state] ? (
              <Notice kind="error" testId="share-ended">{ENDED[share.state]}</Notice>
            ) : actor ? (
              <ShareLanding token={parsed.success ? parsed.data.token : ""} signedInAs={actor.email} sentTo={share.email} />
            ) : (
              <div className="flex flex-col gap-3">
                <LinkButton href={`/signin?callbackUrl=${encodeURIComponent(here)}&email=${encodeURIComponent(share.email)}`} data-testid="share-signin">
                  I have an account: sign in
                </LinkButton>
                <LinkButton tone="secondary" href={`/signup?callbackUrl=${encodeURIComponent(here)}`} data-testid="share-signup">
                  Make an account
                </LinkButton>
              </div>
            )}
            <p className="text-sm text-ink-muted">{SHARING_CAUTION}</p>
          </>
        )}
      </main>
    </div>
  );
}
