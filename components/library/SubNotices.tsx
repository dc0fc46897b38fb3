"use client";
// What a sub is told: they read only what the leader shared with them, so a missing chart is a
// refusal in plain words (not a sync problem), and an empty book says what they can do.
import Link from "next/link";
import { Notice } from "@/components/ui/Notice";

export function NotSharedWithSub({ bandId }: { bandId: string }) {
  return (
    <main id="main" className="mx-auto max-w-3xl p-6">
      <Notice kind="error" title="This chart is not shared with you" testId="sub-refused">
        <p>
          As a sub you read the charts on the set lists the leader shares with you, until the share ends. Ask the leader if
          you need this one.
        </p>
        <p className="mt-2">
          <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}/setlists`}>
            Your shared set lists
          </Link>{" "}
          ·{" "}
          <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}`}>
            Your charts
          </Link>
        </p>
      </Notice>
    </main>
  );
}

export function SubEmptyBook({ bandId }: { bandId: string }) {
  return (
    <Notice title="Nothing shared with you yet" testId="sub-empty">
      <p>
        As a sub you read what the leader shares with you: a set list and its charts, on this device and offline too, until
        the share ends. When the leader sends one, open the link in the e-mail; its charts then appear here and under{" "}
        <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}/setlists`}>
          Set lists
        </Link>
        .
      </p>
    </Notice>
  );
}
