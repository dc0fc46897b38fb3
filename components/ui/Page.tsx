import type { ReactNode } from "react";
import { cx } from "./cx";

/** The readable column every product screen sits in. */
export function PageColumn({ children, wide = false, className }: { children: ReactNode; wide?: boolean; className?: string }) {
  return <main id="main" className={cx("mx-auto w-full px-4 py-6 sm:px-6", wide ? "max-w-6xl" : "max-w-3xl", className)}>{children}</main>;
}

export function PageTitle({ children, lead }: { children: ReactNode; lead?: ReactNode }) {
  return (
    <div className="mb-6">
      <h1 className="text-2xl font-bold tracking-tight text-ink sm:text-3xl">{children}</h1>
      {lead ? <p className="mt-1 text-ink-muted">{lead}</p> : null}
    </div>
  );
}
