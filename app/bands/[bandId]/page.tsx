import type { Metadata } from "next";
import { Suspense } from "react";
import { LibraryScreen } from "@/components/library/LibraryScreen";

export const metadata: Metadata = { title: "Library" };

// A shell: the service worker serves it for any band, and the screen reads the band from the address.
export default function LibraryPage() {
  return (
    <Suspense fallback={null}>
      <LibraryScreen />
    </Suspense>
  );
}
