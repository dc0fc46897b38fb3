import type { Metadata } from "next";
import { SettingsScreen } from "@/components/bandstand/SettingsScreen";

export const metadata: Metadata = { title: "Reading settings" };

export default function SettingsPage() {
  return <SettingsScreen />;
}
