"use client";
import { useEffect } from "react";
import { Button, LinkButton } from "@/components/ui/Button";
import { PageColumn } from "@/components/ui/Page";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <PageColumn>
      <div role="alert">
        <h1 className="text-2xl font-bold text-ink">Something went wrong</h1>
        <p className="mt-2 text-ink-muted">
          This screen hit a problem. Charts already on this device are safe; try again, or go back to your bands.
        </p>
        {error.digest ? <p className="mt-2 text-sm text-ink-muted">Reference: {error.digest}</p> : null}
      </div>
      <div className="mt-6 flex flex-wrap gap-3">
        <Button onClick={reset}>Try again</Button>
        <LinkButton href="/bands" tone="secondary">
          Your bands
        </LinkButton>
      </div>
    </PageColumn>
  );
}
