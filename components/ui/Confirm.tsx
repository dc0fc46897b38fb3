"use client";
// One way to ask before anything is removed or changed for everyone: inline, next to the button that
// asked, never a browser pop-up. The question is a labelled group that takes focus, so a screen reader
// reads it and Escape (or "Keep") backs out.
import { useEffect, useRef, type ReactNode } from "react";
import { Button, type Tone } from "./Button";

interface Props {
  /** The question, in plain words: "Delete “Friday” for the whole band?" */
  question: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  tone?: Tone;
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
  testId?: string;
}

export function ConfirmInline({ question, confirmLabel, cancelLabel = "Keep it", tone = "danger", busy, onConfirm, onCancel, testId }: Props) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => ref.current?.focus(), []);
  return (
    <div
      ref={ref}
      role="group"
      aria-label={typeof question === "string" ? question : confirmLabel}
      tabIndex={-1}
      className="flex flex-wrap items-center gap-2 rounded-md border border-red-800 bg-paper p-2 outline-none"
      onKeyDown={(e) => {
        if (e.key === "Escape") onCancel();
      }}
      data-testid={testId}
    >
      <span className="font-semibold">{question}</span>
      <Button tone={tone} onClick={onConfirm} disabled={busy} data-testid={testId ? `${testId}-yes` : undefined}>
        {confirmLabel}
      </Button>
      <Button tone="secondary" onClick={onCancel} disabled={busy}>
        {cancelLabel}
      </Button>
    </div>
  );
}
