import type { Metadata } from "next";
import { Suspense } from "react";
import { ChartScreen } from "@/components/chart/ChartScreen";

export const metadata: Metadata = { title: "Chart" };

// A shell: the service worker serves it for any chart, and the screen reads ids from the address.
export default function ChartPage() {
  return (
    <Suspense fallback={null}>
      <ChartScreen />
    </Suspense>
  );
}
