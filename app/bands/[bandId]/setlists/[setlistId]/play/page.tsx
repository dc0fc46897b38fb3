import type { Metadata } from "next";
import { Suspense } from "react";
import { PlaySet } from "@/components/setlist/PlaySet";

export const metadata: Metadata = { title: "Play the set" };

// A shell: the set and its charts come from the local book, so it plays with no signal.
export default function PlaySetPage() {
  return (
    <Suspense fallback={null}>
      <PlaySet />
    </Suspense>
  );
}
