import type { Metadata } from "next";
import { Suspense } from "react";
import { ImportScreen } from "@/components/import/ImportScreen";

export const metadata: Metadata = { title: "Import charts" };

// A shell like every band page: the screen reads the band from the address.
export default function ImportPage() {
  return (
    <Suspense fallback={null}>
      <ImportScreen />
    </Suspense>
  );
}
