import type { Metadata } from "next";
import { Suspense } from "react";
import { BandstandScreen } from "@/components/bandstand/BandstandScreen";

export const metadata: Metadata = { title: "Bandstand view" };

// A shell like the chart page: everything comes from the address bar and the local book.
export default function BandstandPage() {
  return (
    <Suspense fallback={null}>
      <BandstandScreen />
    </Suspense>
  );
}
