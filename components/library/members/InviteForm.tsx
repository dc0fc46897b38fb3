"use client";
// Invite someone by e-mail with a role, the part they read and, for a sub, when access ends.
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field, SelectField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { INSTRUMENT_OPTIONS, ROLE_HINTS, ROLE_OPTIONS } from "@/components/ui/labels";
import type { Role } from "@/db/schema";
import { IDLE, type MemberFormState } from "./form-state";
import { LocalDateTime } from "./LocalDateTime";

type Action = (prev: MemberFormState, form: FormData) => Promise<MemberFormState>;

export function InviteForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE);
  const [role, setRole] = useState<Role>("player");
  return (
    <form action={formAction} className="grid gap-4 sm:grid-cols-2" data-testid="invite-form" noValidate>
      <div aria-live="polite" className="sm:col-span-2" data-testid="invite-result">
        {state.status === "ok" ? <Notice kind="success">{state.message}</Notice> : null}
        {state.status === "error" ? <Notice kind="error" title="Invite not sent">{state.message}</Notice> : null}
      </div>
      <Field label="E-mail address" name="email" type="email" autoComplete="off" required error={state.fields.email} className="sm:col-span-2" data-testid="invite-email" />
      <SelectField
        label="Role"
        name="role"
        value={role}
        onChange={(e) => setRole(e.target.value as Role)}
        options={ROLE_OPTIONS}
        hint={`A ${role} ${ROLE_HINTS[role]}.`}
        error={state.fields.role}
        data-testid="invite-role"
      />
      <SelectField label="Part they read" name="instrument" defaultValue="concert" options={INSTRUMENT_OPTIONS} error={state.fields.instrument} data-testid="invite-instrument" />
      {role === "sub" ? (
        <LocalDateTime
          name="accessExpiresAt"
          label="Access ends (optional)"
          hint="After this time the sub can no longer open the band's charts."
          error={state.fields.accessExpiresAt}
          testId="invite-until"
        />
      ) : null}
      <div className="sm:col-span-2">
        <Button type="submit" disabled={pending} data-testid="invite-send">
          {pending ? "Sending…" : "Send invite"}
        </Button>
      </div>
    </form>
  );
}
