import { defineConfig, devices } from "@playwright/test";

// End-to-end tests run real Chromium against the production build (`next build` + `next start`),
// a fresh SQLite file seeded with the demo band, and the local mail and payment fakes.
const PORT = Number(process.env.E2E_PORT ?? 3100);
export const baseURL = `http://localhost:${PORT}`;
// The local fakes sit just above the app's port, so two checkouts can run their suites side by side.
const MAIL_FAKE_HTTP_PORT = String(PORT + 26);
process.env.MAIL_FAKE_HTTP_PORT ??= MAIL_FAKE_HTTP_PORT;
const PUSH_FAKE_PORT = String(PORT + 28);
process.env.PUSH_FAKE_PORT ??= PUSH_FAKE_PORT;

export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"]],
  outputDir: "test-results/e2e",
  use: {
    baseURL,
    trace: "retain-on-failure",
    ...devices["Desktop Chrome"],
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--headless",
        "--disable-gpu",
        "--disable-quic",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
      ],
    },
  },
  // Every spec on a laptop; on a 390 px phone again, the tests tagged @phone: the bandstand view and the
  // stage checks whose layout depends on the screen. (Specs that need a phone for one step, such as the
  // set list's, push and the call, open a 390 px context of their own.)
  projects: [
    { name: "laptop", use: { ...devices["Desktop Chrome"] } },
    {
      name: "phone",
      grep: /@phone/,
      use: { ...devices["Desktop Chrome"], viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, hasTouch: true },
    },
  ],
  webServer: {
    command: process.env.E2E_SKIP_BUILD ? "npm start -- --fresh --seed" : "npm run build && npm start -- --fresh --seed",
    url: `${baseURL}/api/health`,
    timeout: 300_000,
    reuseExistingServer: false,
    stdout: "pipe",
    stderr: "pipe",
    env: {
      PORT: String(PORT),
      DATABASE_PATH: "data/e2e/pedalpoint.db",
      DATA_DIR: "data/e2e",
      NEXTAUTH_URL: baseURL,
      NEXTAUTH_SECRET: "e2e-only-secret-not-for-production",
      MAIL_FAKE: "1",
      SMTP_PORT: String(PORT + 25),
      MAIL_FAKE_HTTP_PORT,
      PAYMENT_FAKE: "1",
      // The suite signs the demo accounts in hundreds of times from one address.
      RATE_LIMIT_FACTOR: "50",
      PAYMENT_FAKE_PORT: String(PORT + 27),
      PUSH_FAKE: "1",
      PUSH_FAKE_PORT,
    },
  },
});
