import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { LinkButton } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { formatDateTime, instrumentLabel, roleLabel } from "@/components/ui/labels";
import { InviteForm } from "@/components/library/members/InviteForm";
import { MemberRow } from "@/components/library/members/MemberRow";
import { ready } from "@/db";
import { getBand } from "@/lib/server/bands";
import { AppError } from "@/lib/server/errors";
import { listInvites, listMembers } from "@/lib/server/members";
import { getActor } from "@/lib/server/session";
import { IdSchema } from "@/lib/validation/common";
import { inviteAction, removeMemberAction, updateMemberAction } from "./actions";
import { byRole } from "@/lib/band/roles";

export const metadata: Metadata = { title: "Members" };

// Leader-only and server-rendered: managing the roster needs the network anyway.
export default async function MembersPage({ params }: { params: Promise<{ bandId: string }> }) {
  const raw = (await params).bandId;
  const parsed = IdSchema.safeParse(raw);
  if (!parsed.success) notFound();
  const bandId = parsed.data;
  const actor = await getActor();
  if (!actor) redirect(`/signin?callbackUrl=${encodeURIComponent(`/bands/${bandId}/members`)}`);

  const db = await ready();
  let data;
  try {
    const band = await getBand(db, actor, bandId);
    const [members, invites] = await Promise.all([listMembers(db, actor, bandId), listInvites(db, actor, bandId)]);
    data = { band, members, invites };
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    if (err instanceof AppError && err.code === "forbidden") {
      return (
        <PageColumn>
          <PageTitle>Members</PageTitle>
          <Notice title="Only the band's leader manages members" testId="members-refused">
            <p>{err.message}</p>
            <LinkButton href={`/bands/${encodeURIComponent(bandId)}`} tone="secondary" className="mt-3">
              Back to the library
            </LinkButton>
          </Notice>
        </PageColumn>
      );
    }
    throw err;
  }

  const { band, invites } = data;
  // Leaders first, then arrangers, players and subs; by name within each.
  const members = [...data.members].sort((a, b) => byRole(a.role, b.role) || a.name.localeCompare(b.name));
  return (
    <PageColumn>
      <PageTitle lead={`${band.name}: who is in the band, what they do and the part they read.`}>Members</PageTitle>

      <section aria-labelledby="roster-heading">
        <h2 id="roster-heading" className="text-xl font-semibold">
          Roster <span className="text-base font-normal text-ink-muted">({members.length})</span>
        </h2>
        <ul className="mt-3 divide-y divide-paper-dim rounded-lg border border-paper-dim bg-white" data-testid="roster">
          {members.map((m) => (
            <MemberRow
              key={m.userId}
              member={m}
              isMe={m.userId === actor.userId}
              update={updateMemberAction.bind(null, bandId, m.userId)}
              remove={removeMemberAction.bind(null, bandId, m.userId)}
            />
          ))}
        </ul>
      </section>

      <section aria-labelledby="invite-heading" className="mt-10 rounded-lg border border-paper-dim bg-white p-5">
        <h2 id="invite-heading" className="text-xl font-semibold">
          Invite someone
        </h2>
        <p className="mb-4 text-sm text-ink-muted">They get an e-mail with a link that works once and expires in a week.</p>
        <InviteForm action={inviteAction.bind(null, bandId)} bandId={bandId} />
      </section>

      {invites.length ? (
        <section aria-labelledby="open-invites-heading" className="mt-10">
          <h2 id="open-invites-heading" className="text-xl font-semibold">
            Waiting to join
          </h2>
          <ul className="mt-3 divide-y divide-paper-dim rounded-lg border border-paper-dim bg-white" data-testid="open-invites">
            {invites.map((i) => (
              <li key={i.id} className="flex flex-wrap justify-between gap-2 p-4">
                <span className="font-semibold">{i.email}</span>
                <span className="text-sm text-ink-muted">
                  {roleLabel(i.role)} · {instrumentLabel(i.instrument)} · link valid until {formatDateTime(i.expiresAt)}
                  {i.accessExpiresAt ? ` · access until ${formatDateTime(i.accessExpiresAt)}` : ""}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </PageColumn>
  );
}
