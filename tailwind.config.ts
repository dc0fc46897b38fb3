import type { Config } from "tailwindcss";

// Pedalpoint's own palette: warm brass accent on ink, with two bandstand themes.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#15171c", soft: "#2a2e37", muted: "#5b6170" },
        paper: { DEFAULT: "#fbfaf7", dim: "#f1efe9" },
        brass: { DEFAULT: "#a8620f", dark: "#7f4a0b", light: "#f4dfc2" },
        stage: { DEFAULT: "#0c0d10", text: "#e9e6df" },
        ember: { DEFAULT: "#000000", text: "#c8463b" },
      },
      fontFamily: {
        sans: ["var(--font-text)", "system-ui", "sans-serif"],
      },
    },
  },
};

export default config;
