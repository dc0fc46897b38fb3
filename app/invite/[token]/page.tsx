import type { Metadata } from "next";
import Link from "next/link";
import { ready } from "@/db";
import { Notice } from "@/components/ui/Notice";
import { ROLE_HINTS } from "@/components/ui/labels";
import { previewInvite } from "@/lib/server/members";
import { getActor } from "@/lib/server/session";
import { findUserByEmail } from "@/lib/server/users";
import { SignUpForm } from "@/app/(auth)/_forms/SignUpForm";
import { AcceptInvite } from "./AcceptInvite";
import { aRole } from "@/lib/band/roles";

export const metadata: Metadata = { title: "Your invite" };
export const dynamic = "force-dynamic";

function Shell({ children }: { children: React.ReactNode }) {
  return (
    <main id="main" className="mx-auto w-full max-w-md px-4 py-10 sm:px-6">
      <Link href="/" className="mb-8 block text-lg font-bold tracking-tight text-ink">
        Pedalpoint
      </Link>
      {children}
    </main>
  );
}

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const db = await ready();
  const invite = /^[A-Za-z0-9_-]{10,200}$/.test(token) ? await previewInvite(db, token) : null;
  if (!invite || invite.state !== "open") {
    const why = !invite ? "This invite link is not valid." : invite.state === "accepted" ? "This invite was already used." : "This invite has expired.";
    return (
      <Shell>
        <h1 className="mb-4 text-2xl font-bold text-ink">Invite</h1>
        <Notice kind="error" testId="invite-unusable">
          {why} Ask the band&rsquo;s leader to send a new one.
        </Notice>
      </Shell>
    );
  }
  const actor = await getActor();
  const here = `/invite/${token}`;
  return (
    <Shell>
      <h1 className="mb-2 text-2xl font-bold tracking-tight text-ink">Join {invite.bandName}</h1>
      <p className="mb-6 text-ink-muted">
        You are invited as {aRole(invite.role)}: {ROLE_HINTS[invite.role]}.
      </p>
      {actor && actor.email.toLowerCase() === invite.email ? (
        <AcceptInvite token={token} bandId={invite.bandId} bandName={invite.bandName} />
      ) : actor ? (
        <Notice kind="error" title="Signed in as someone else" testId="invite-mismatch">
          This invite was sent to {invite.email}, but you are signed in as {actor.email}.{" "}
          <Link className="underline" href={`/api/auth/signout?callbackUrl=${encodeURIComponent(here)}`}>
            Sign out
          </Link>{" "}
          and open the link again.
        </Notice>
      ) : (await findUserByEmail(db, invite.email)) ? (
        <p>
          You already have an account.{" "}
          <Link className="font-semibold text-brass-dark underline" href={`/signin?callbackUrl=${encodeURIComponent(here)}&email=${encodeURIComponent(invite.email)}`}>
            Sign in to accept
          </Link>
        </p>
      ) : (
        <SignUpForm email={invite.email} inviteToken={token} inviteBandId={invite.bandId} instrument={invite.instrument} callbackUrl={here} />
      )}
    </Shell>
  );
}
