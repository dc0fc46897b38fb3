import type { MetadataRoute } from "next";

// Colours come from tailwind.config.ts: ink for the bar, paper behind the first paint.
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: "/",
    name: "Pedalpoint",
    short_name: "Pedalpoint",
    description: "The band's book of chord charts, in every player's key, on every stand, with or without signal.",
    start_url: "/bands",
    scope: "/",
    display: "standalone",
    orientation: "any",
    background_color: "#fbfaf7",
    theme_color: "#15171c",
    categories: ["music", "productivity"],
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/maskable-192.png", sizes: "192x192", type: "image/png", purpose: "maskable" },
      { src: "/icons/maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
      { src: "/icons/pedalpoint.svg", sizes: "any", type: "image/svg+xml", purpose: "any" },
    ],
  };
}
