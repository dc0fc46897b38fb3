/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // A separate build folder per parallel build (benchmarks, local checks); the default is .next.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["better-sqlite3", "smtp-server", "nodemailer"],
};

export default nextConfig;
