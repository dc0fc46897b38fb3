import { defineConfig, devices } from "@playwright/test";
// Temporary: runs the e2e spec against a server started by hand on port 3500.
export default defineConfig({
  testDir: "tests/e2e",
  workers: 1,
  timeout: 90_000,
  expect: { timeout: 15_000 },
  reporter: [["list"]],
  outputDir: "/tmp/ui-e2e-results",
  use: {
    baseURL: "http://localhost:3500",
    ...devices["Desktop Chrome"],
    trace: "retain-on-failure",
    launchOptions: { executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--headless", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"] },
  },
});
