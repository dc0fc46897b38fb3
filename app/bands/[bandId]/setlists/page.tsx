import type { Metadata } from "next";
import { Suspense } from "react";
import { SetlistsScreen } from "@/components/setlist/SetlistsScreen";

export const metadata: Metadata = { title: "Set lists" };

// A shell: the service worker serves it for any band, and the screen reads the band from the address.
export default function SetlistsPage() {
  return (
    <Suspense fallback={null}>
      <SetlistsScreen />
    </Suspense>
  );
}
