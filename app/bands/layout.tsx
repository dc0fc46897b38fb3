import { BandShell } from "@/components/sync/BandShell";

// Every band page is a client shell under this layout: the device's session and book, not the
// server's HTML, decide what is shown, so the service worker can serve these pages with no signal.
export default function BandsLayout({ children }: { children: React.ReactNode }) {
  return <BandShell>{children}</BandShell>;
}
