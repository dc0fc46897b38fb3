import type { Metadata } from "next";
import { Suspense } from "react";
import { PrintSet } from "@/components/setlist/PrintSet";

export const metadata: Metadata = { title: "Print set list" };

export default function PrintSetPage() {
  return (
    <Suspense fallback={null}>
      <PrintSet />
    </Suspense>
  );
}
