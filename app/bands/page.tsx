import type { Metadata } from "next";
import { Suspense } from "react";
import { BandsScreen } from "@/components/library/BandsScreen";

export const metadata: Metadata = { title: "Your bands" };

export default function BandsPage() {
  return (
    <Suspense fallback={null}>
      <BandsScreen />
    </Suspense>
  );
}
