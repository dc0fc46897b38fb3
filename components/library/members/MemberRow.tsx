"use client";
// One person on the roster: change their role, part and (for a sub) access end; or remove them.
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/Button";
import { SelectField } from "@/components/ui/Field";
import { formatDateTime, INSTRUMENT_OPTIONS, ROLE_OPTIONS, roleLabel } from "@/components/ui/labels";
import { accessEnds, type Role } from "@/lib/band/roles";
import type { WireMember } from "@/lib/wire";
import { IDLE, type MemberFormState } from "./form-state";
import { LocalDateTime } from "./LocalDateTime";

type Action = (prev: MemberFormState, form: FormData) => Promise<MemberFormState>;

export function MemberRow({ member, isMe, update, remove }: { member: WireMember; isMe: boolean; update: Action; remove: Action }) {
  const [saved, saveAction, saving] = useActionState(update, IDLE);
  const [removed, removeAction, removing] = useActionState(remove, IDLE);
  const [role, setRole] = useState<Role>(member.role);
  const [confirming, setConfirming] = useState(false);
  const outcome = removed.status !== "idle" ? removed : saved;

  return (
    <li className="p-4" data-testid="member-row" data-email={member.email}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-lg font-semibold">
          {member.name}
          {isMe ? <span className="ml-2 text-sm font-normal text-ink-muted">(you)</span> : null}
        </h3>
        <p className="text-sm text-ink-muted">
          {member.email} · {roleLabel(member.role)}
          {member.expiresAt ? ` until ${formatDateTime(member.expiresAt)}` : ""}
        </p>
      </div>
      <form action={saveAction} className="mt-3 grid gap-3 sm:grid-cols-[1fr_1fr_1fr_auto] sm:items-end">
        <SelectField
          label={
            <>
              Role<span className="sr-only"> of {member.name}</span>
            </>
          }
          name="role"
          value={role}
          onChange={(e) => setRole(e.target.value as Role)}
          options={ROLE_OPTIONS}
          error={saved.fields.role}
          data-testid="member-role"
        />
        <SelectField
          label={
            <>
              Part<span className="sr-only"> {member.name} reads</span>
            </>
          }
          name="instrument"
          defaultValue={member.instrument}
          options={INSTRUMENT_OPTIONS}
          error={saved.fields.instrument}
        />
        {accessEnds(role) ? (
          <LocalDateTime name="expiresAt" label="Access ends (optional)" initial={member.expiresAt} error={saved.fields.expiresAt} />
        ) : (
          <p className="self-center text-sm text-ink-muted">No end to access</p>
        )}
        <Button type="submit" tone="secondary" disabled={saving} data-testid="member-save">
          {saving ? "Saving…" : "Save"}
        </Button>
      </form>
      <form action={removeAction} className="mt-3 flex flex-wrap items-center gap-2">
        {confirming ? (
          <>
            <span className="text-sm font-semibold">{isMe ? "Leave this band?" : `Remove ${member.name} from the band?`}</span>
            <Button type="submit" tone="danger" disabled={removing} data-testid="member-remove-confirm">
              {removing ? "Removing…" : isMe ? "Yes, leave" : "Yes, remove"}
            </Button>
            <Button tone="quiet" onClick={() => setConfirming(false)}>
              Keep
            </Button>
          </>
        ) : (
          <Button tone="quiet" onClick={() => setConfirming(true)} data-testid="member-remove">
            {isMe ? "Leave the band" : `Remove ${member.name}`}
          </Button>
        )}
      </form>
      <div aria-live="polite">
        {outcome.status !== "idle" ? (
          <p className={outcome.status === "error" ? "mt-2 text-sm font-semibold text-red-800" : "mt-2 text-sm text-emerald-900"} data-testid="member-result">
            {outcome.message}
          </p>
        ) : null}
      </div>
    </li>
  );
}
