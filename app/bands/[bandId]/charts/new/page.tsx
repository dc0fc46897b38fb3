import type { Metadata } from "next";
import { NewChartScreen } from "@/components/library/ChartEditScreens";

export const metadata: Metadata = { title: "New chart" };

export default function NewChartPage() {
  return <NewChartScreen />;
}
