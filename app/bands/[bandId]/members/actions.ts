"use server";
// The leader's member screen. Each action resolves the user and calls a use case in lib/server,
// which checks the role itself; these functions only shape form data and errors.
import { revalidatePath } from "next/cache";
import { ready } from "@/db";
import { AppError } from "@/lib/server/errors";
import { inviteMember, removeMember, updateMember } from "@/lib/server/members";
import { getActor } from "@/lib/server/session";
import { IdSchema } from "@/lib/validation/common";
import type { MemberFormState } from "@/components/library/members/form-state";
import { aRole, accessEnds } from "@/lib/band/roles";

function text(form: FormData, name: string): string {
  const v = form.get(name);
  return typeof v === "string" ? v.trim() : "";
}

function failed(err: unknown): MemberFormState {
  if (err instanceof AppError) {
    const fields: Record<string, string> = {};
    for (const f of err.details?.fields ?? []) fields[f.field] ??= f.message;
    return { status: "error", message: err.message, fields, code: err.code };
  }
  console.error(err);
  return { status: "error", message: "Something went wrong on the server. Nothing was changed.", fields: {} };
}

function ids(...values: string[]): string[] {
  return values.map((v) => IdSchema.parse(v));
}

export async function inviteAction(bandId: string, _prev: MemberFormState, form: FormData): Promise<MemberFormState> {
  try {
    const [band] = ids(bandId) as [string];
    const role = text(form, "role");
    const until = text(form, "accessExpiresAt");
    const result = await inviteMember(await ready(), await getActor(), band, {
      email: text(form, "email"),
      role,
      instrument: text(form, "instrument") || "concert",
      // An end time only means something for a sub.
      accessExpiresAt: accessEnds(role) && until ? until : null,
    });
    revalidatePath(`/bands/${band}/members`);
    return {
      status: "ok",
      message: result.mailed
        ? `Invite sent to ${result.invite.email}.`
        : `The invite e-mail could not be sent. Pass this link to ${result.invite.email} yourself: ${result.link}`,
      fields: {},
    };
  } catch (err) {
    return failed(err);
  }
}

export async function updateMemberAction(bandId: string, userId: string, _prev: MemberFormState, form: FormData): Promise<MemberFormState> {
  try {
    const [band, user] = ids(bandId, userId) as [string, string];
    const role = text(form, "role");
    const until = text(form, "expiresAt");
    const updated = await updateMember(await ready(), await getActor(), band, user, {
      role,
      instrument: text(form, "instrument"),
      expiresAt: accessEnds(role) && until ? until : null,
    });
    revalidatePath(`/bands/${band}/members`);
    return { status: "ok", message: `Saved: ${updated.name} is now ${aRole(updated.role)}.`, fields: {} };
  } catch (err) {
    return failed(err);
  }
}

export async function removeMemberAction(bandId: string, userId: string): Promise<MemberFormState> {
  try {
    const [band, user] = ids(bandId, userId) as [string, string];
    await removeMember(await ready(), await getActor(), band, user);
    revalidatePath(`/bands/${band}/members`);
    return { status: "ok", message: "Removed from the band.", fields: {} };
  } catch (err) {
    return failed(err);
  }
}
