"use client";
// Around every band page: trust the last session this device saw (so no signal never means
// "sign in"), start the sync engine, and show the slim bar with the sync status.
import Link from "next/link";
import { usePathname, useRouter } from "next/navigation";
import { useEffect, type ReactNode } from "react";
import { AppHeader, SkipLink, isStagePath } from "@/components/AppHeader";
import { useEngineState, useLocalSession, useOnline } from "@/lib/offline/hooks";
import { getSyncEngine } from "@/lib/offline/sync";
import { startSyncTriggers } from "@/lib/offline/triggers";
import { SyncStatus } from "./SyncStatus";
import { UpdatePrompt } from "./UpdatePrompt";

function Gate({ children }: { children: ReactNode }) {
  const session = useLocalSession();
  const engine = useEngineState();
  const online = useOnline();
  const router = useRouter();
  const needsSignIn = session === null && engine.problem === "auth";

  useEffect(() => {
    if (needsSignIn) router.replace(`/signin?callbackUrl=${encodeURIComponent(window.location.pathname + window.location.search)}`);
  }, [needsSignIn, router]);

  if (session) return <>{children}</>;
  let text = "Opening your book…";
  if (session === null) {
    text = needsSignIn ? "Taking you to sign in…" : online ? "Checking your sign-in…" : "This device has no copy of a band's book yet. Connect to the internet once and sign in; after that it works without signal.";
  }
  return (
    <main id="main" className="mx-auto max-w-xl p-6" aria-busy={session === undefined}>
      <p role="status" aria-live="polite" data-testid="session-gate">
        {text}
      </p>
      {session === null && !online ? (
        <p className="mt-3">
          <Link className="font-semibold underline" href="/">
            Home
          </Link>
        </p>
      ) : null}
    </main>
  );
}

export function BandShell({ children }: { children: ReactNode }) {
  // The router's path, not the address bar: after a client navigation (Close on the bandstand) the
  // new page renders before the address bar changes, and a served shell's path still names its route.
  const onStage = isStagePath(usePathname());

  useEffect(() => startSyncTriggers(getSyncEngine()), []);

  return (
    <>
      {/* First in the tab order, before the update prompt and the sync status. */}
      {onStage ? null : <SkipLink />}
      <UpdatePrompt />
      {onStage ? null : (
        <div className="no-print flex items-center justify-end gap-2 bg-ink px-2 text-paper sm:px-4" data-testid="sync-bar">
          <SyncStatus />
        </div>
      )}
      {onStage ? null : <AppHeader />}
      <Gate>{children}</Gate>
    </>
  );
}
