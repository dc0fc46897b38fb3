"use server";
// The leader's member screen. Each action runs through action(), which parses the ids it was bound
// to, resolves the user and hands over the database; the use case in lib/server checks the role
// itself. These functions only shape form data and the answer.
import { revalidatePath } from "next/cache";
import { action, type ActionOutcome } from "@/lib/server/action";
import { inviteMember, removeMember, updateMember } from "@/lib/server/members";
import { BandParams, MemberParams } from "@/lib/validation/params";
import type { MemberFormState } from "@/components/library/members/form-state";
import { aRole, accessEnds } from "@/lib/band/roles";

function text(form: FormData, name: string): string {
  const v = form.get(name);
  return typeof v === "string" ? v.trim() : "";
}

function answer(outcome: ActionOutcome<string>): MemberFormState {
  if (outcome.ok) return { status: "ok", message: outcome.value, fields: {} };
  const { code, message, fields: issues } = outcome.failure;
  const fields: Record<string, string> = {};
  for (const f of issues) fields[f.field] ??= f.message;
  return code === "internal" ? { status: "error", message, fields } : { status: "error", message, fields, code };
}

export async function inviteAction(bandId: string, _prev: MemberFormState, form: FormData): Promise<MemberFormState> {
  const outcome = await action({ params: BandParams }, { bandId }, async ({ db, actor, params }) => {
    const role = text(form, "role");
    const until = text(form, "accessExpiresAt");
    const result = await inviteMember(db, actor, params.bandId, {
      email: text(form, "email"),
      role,
      instrument: text(form, "instrument") || "concert",
      // An end time only means something for a sub.
      accessExpiresAt: accessEnds(role) && until ? until : null,
    });
    revalidatePath(`/bands/${params.bandId}/members`);
    return result.mailed
      ? `Invite sent to ${result.invite.email}.`
      : `The invite e-mail could not be sent. Pass this link to ${result.invite.email} yourself: ${result.link}`;
  });
  return answer(outcome);
}

export async function updateMemberAction(bandId: string, userId: string, _prev: MemberFormState, form: FormData): Promise<MemberFormState> {
  const outcome = await action({ params: MemberParams }, { bandId, userId }, async ({ db, actor, params }) => {
    const role = text(form, "role");
    const until = text(form, "expiresAt");
    const updated = await updateMember(db, actor, params.bandId, params.userId, {
      role,
      instrument: text(form, "instrument"),
      expiresAt: accessEnds(role) && until ? until : null,
    });
    revalidatePath(`/bands/${params.bandId}/members`);
    return `Saved: ${updated.name} is now ${aRole(updated.role)}.`;
  });
  return answer(outcome);
}

export async function removeMemberAction(bandId: string, userId: string): Promise<MemberFormState> {
  const outcome = await action({ params: MemberParams }, { bandId, userId }, async ({ db, actor, params }) => {
    await removeMember(db, actor, params.bandId, params.userId);
    revalidatePath(`/bands/${params.bandId}/members`);
    return "Removed from the band.";
  });
  return answer(outcome);
}
