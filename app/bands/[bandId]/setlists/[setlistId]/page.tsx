import type { Metadata } from "next";
import { Suspense } from "react";
import { GigScreen } from "@/components/setlist/GigScreen";

export const metadata: Metadata = { title: "Set list" };

// A shell: the set list comes from the local book, picked by the address.
export default function SetlistPage() {
  return (
    <Suspense fallback={null}>
      <GigScreen />
    </Suspense>
  );
}
