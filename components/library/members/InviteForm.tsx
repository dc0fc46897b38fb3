"use client";
// Invite someone by e-mail with a role, the part they read and, for a sub, when access ends.
import Link from "next/link";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field, SelectField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { INSTRUMENT_OPTIONS, ROLE_HINTS, ROLE_OPTIONS } from "@/components/ui/labels";
import { accessEnds, type Role } from "@/lib/band/roles";
import { IDLE, type MemberFormState } from "./form-state";
import { LocalDateTime } from "./LocalDateTime";

type Action = (prev: MemberFormState, form: FormData) => Promise<MemberFormState>;

export function InviteForm({ action, bandId }: { action: Action; bandId?: string }) {
  // The address is kept in state: a refused invite (a full plan) must not wipe what was typed.
  const [email, setEmail] = useState("");
  const [state, formAction, pending] = useActionState(async (prev: MemberFormState, form: FormData) => {
    const next = await action(prev, form);
    if (next.status === "ok") setEmail("");
    return next;
  }, IDLE);
  const [role, setRole] = useState<Role>("player");
  return (
    <form action={formAction} className="grid gap-4 sm:grid-cols-2" data-testid="invite-form" noValidate>
      <div aria-live="polite" className="sm:col-span-2" data-testid="invite-result">
        {state.status === "ok" ? <Notice kind="success">{state.message}</Notice> : null}
        {state.status === "error" ? (
          <Notice kind="error" title="Invite not sent">
            {state.message}
            {state.code === "payment_required" && bandId ? (
              <>
                {" "}
                <Link className="font-semibold underline" href={`/bands/${encodeURIComponent(bandId)}/plan`} data-testid="invite-plan-link">
                  See the band&rsquo;s plan
                </Link>
              </>
            ) : null}
          </Notice>
        ) : null}
      </div>
      <Field
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="off"
        required
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={state.fields.email}
        className="sm:col-span-2"
        data-testid="invite-email"
      />
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
      {accessEnds(role) ? (
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
