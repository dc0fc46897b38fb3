import Link from "next/link";
import type { ButtonHTMLAttributes, ComponentProps } from "react";
import { cx } from "./cx";

export type Tone = "primary" | "secondary" | "quiet" | "danger";

// Every control is at least 44px tall so it can be hit on a phone on a music stand.
const BASE =
  "inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 text-base font-semibold " +
  "transition-colors disabled:cursor-not-allowed disabled:opacity-60";

const TONES: Record<Tone, string> = {
  primary: "bg-brass-dark text-paper hover:bg-ink",
  secondary: "border border-ink-soft bg-paper text-ink hover:bg-paper-dim",
  quiet: "text-ink underline-offset-4 hover:underline",
  danger: "border border-red-800 bg-paper text-red-800 hover:bg-red-50",
};

export function buttonClass(tone: Tone = "primary", extra?: string): string {
  return cx(BASE, TONES[tone], extra);
}

export function Button({
  tone = "primary",
  className,
  type = "button",
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  return <button type={type} className={buttonClass(tone, className)} {...rest} />;
}

export function LinkButton({ tone = "primary", className, ...rest }: ComponentProps<typeof Link> & { tone?: Tone }) {
  return <Link className={buttonClass(tone, className)} {...rest} />;
}
