"use client";
// A date-time picker in the device's own time zone that submits an ISO time in UTC, so the server
// never has to guess which zone the leader meant.
import { useId, useState } from "react";
import { CONTROL } from "@/components/ui/Field";
import { toLocalInput } from "@/components/setlist/datetime";

function toIso(local: string): string {
  if (!local) return "";
  const d = new Date(local);
  return Number.isNaN(d.getTime()) ? "" : d.toISOString();
}

export function LocalDateTime({
  name,
  label,
  initial = null,
  error,
  hint,
  disabled,
  testId,
}: {
  name: string;
  label: string;
  initial?: string | null;
  error?: string;
  hint?: string;
  disabled?: boolean;
  testId?: string;
}) {
  const id = useId();
  const [local, setLocal] = useState(() => toLocalInput(initial));
  const described = [hint ? `${id}-hint` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <input
        id={id}
        type="datetime-local"
        className={CONTROL}
        value={local}
        onChange={(e) => setLocal(e.target.value)}
        disabled={disabled}
        aria-invalid={error ? true : undefined}
        aria-describedby={described}
        data-testid={testId}
      />
      <input type="hidden" name={name} value={disabled ? "" : toIso(local)} />
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-red-800">
          {error}
        </p>
      ) : null}
    </div>
  );
}
