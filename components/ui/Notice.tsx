import type { ReactNode } from "react";
import { cx } from "./cx";

type Kind = "info" | "error" | "success";

const KINDS: Record<Kind, string> = {
  info: "border-ink-soft bg-paper-dim text-ink",
  error: "border-red-800 bg-red-50 text-red-900",
  success: "border-emerald-800 bg-emerald-50 text-emerald-900",
};

/** A boxed message. Errors are announced at once; other notices politely. */
export function Notice({ kind = "info", title, children, className, testId }: {
  kind?: Kind;
  title?: string;
  children?: ReactNode;
  className?: string;
  testId?: string;
}) {
  return (
    <div
      role={kind === "error" ? "alert" : "status"}
      className={cx("rounded-md border-l-4 px-4 py-3", KINDS[kind], className)}
      data-testid={testId}
    >
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className="text-sm">{children}</div> : null}
    </div>
  );
}
