import type { Metadata } from "next";
import { Suspense } from "react";
import { PlanScreen } from "@/components/plan/PlanScreen";

export const metadata: Metadata = { title: "Plan" };

// Leader only (the server refuses others); the screen reads the band from the address.
export default function PlanPage() {
  return (
    <Suspense fallback={null}>
      <PlanScreen />
    </Suspense>
  );
}
