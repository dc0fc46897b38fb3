import type { Metadata, Viewport } from "next";
import { headers } from "next/headers";
import localFont from "next/font/local";
import "./globals.css";
import { SerwistProvider } from "@serwist/next/react";
import { serviceWorkerUrl } from "@/lib/offline/sw-url";

const text = localFont({
  src: [
    { path: "./fonts/inter-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "./fonts/inter-latin-600-normal.woff2", weight: "600", style: "normal" },
    { path: "./fonts/inter-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-text",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Pedalpoint", template: "%s · Pedalpoint" },
  description: "The band's book of lead sheets and chord charts, in every player's key, on every stand, with or without signal.",
  applicationName: "Pedalpoint",
};

export const viewport: Viewport = {
  themeColor: "#15171c",
  width: "device-width",
  initialScale: 1,
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Reading the request makes every page render per request, so each gets the proxy's fresh CSP
  // nonce on its scripts (a page built ahead of time would carry none and be blocked).
  const nonce = (await headers()).get("x-nonce") ?? undefined;
  return (
    <html lang="en" className={text.variable}>
      <head>
        {/* zod compiles fast parsers with new Function unless told not to; the CSP forbids eval, so
            it is told before any app script runs (its probe would otherwise log a violation). */}
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: "globalThis.__zod_globalConfig=Object.assign(globalThis.__zod_globalConfig||{},{jitless:true});" }} />
      </head>
      <body className="min-h-screen font-sans antialiased">
        {/* The service worker keeps the app usable with no signal (worker/sw.ts). The book itself syncs into IndexedDB. */}
        <SerwistProvider swUrl={serviceWorkerUrl(process.env.NEXT_DIST_DIR)} disable={process.env.NODE_ENV === "development"} reloadOnOnline={false} cacheOnNavigation={false}>
          {children}
        </SerwistProvider>
      </body>
    </html>
  );
}
