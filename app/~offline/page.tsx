import type { Metadata } from "next";
import Link from "next/link";

export const metadata: Metadata = { title: "No signal" };
// Rendered per request like every page (the CSP nonce, see app/layout.tsx); the service worker
// stores it once, with its matching policy header.

// Served by the service worker for a page that needs the network when there is none.
// The band's book (library, charts, set lists, bandstand) is stored on the device and still opens.
export default function OfflinePage() {
  return (
    <main id="main" className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold">No signal</h1>
      <p className="mt-3">
        This page needs a connection, and this device has none right now. Everything your band has synced here still works:
        the library, every chart in your key, set lists and the bandstand view.
      </p>
      <p className="mt-4">
        <Link className="inline-flex min-h-11 items-center rounded-md bg-brass-dark px-4 font-semibold text-paper" href="/bands">
          Open your bands
        </Link>
      </p>
    </main>
  );
}
