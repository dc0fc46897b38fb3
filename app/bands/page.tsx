import type { Metadata } from "next";
import { BandsScreen } from "@/components/library/BandsScreen";

export const metadata: Metadata = { title: "Your bands" };

export default function BandsPage() {
  return <BandsScreen />;
}
