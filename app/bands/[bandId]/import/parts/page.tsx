import type { Metadata } from "next";
import { Suspense } from "react";
import { PartsScreen } from "@/components/import/PartsScreen";

export const metadata: Metadata = { title: "Parts" };

// A shell: the chart and part come from the address (?chart=…&part=…), the files from this device.
export default function PartsPage() {
  return (
    <Suspense fallback={null}>
      <PartsScreen />
    </Suspense>
  );
}
