import type { Metadata } from "next";
import { EditChartScreen } from "@/components/library/ChartEditScreens";

export const metadata: Metadata = { title: "Edit chart" };

export default function EditChartPage() {
  return <EditChartScreen />;
}
