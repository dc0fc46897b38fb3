import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", ".next-*/**", ".*.mjs", ".*.ts", "node_modules/**", "public/sw.js", "public/sw-*.js", "public/swe-worker*.js", "public/**/*.mjs", "next-env.d.ts", "test-results/**", "playwright-report/**", "data/**"],
  },
];

export default config;
