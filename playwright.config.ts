import { defineConfig, devices } from "@playwright/test";

// End-to-end tests run against a production build served by our own server on
// port 3100, on a freshly seeded database (scripts/test.sh prepares both), in
// Debian's Chromium. No browser is downloaded.
const PORT = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://localhost:${PORT}`;

export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json", { outputFile: "reports/playwright.json" }]],
  use: {
    baseURL,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
      ],
    },
  },
  projects: [{ name: "chromium", use: { ...devices["Desktop Chrome"] } }],
  webServer: {
    // The compiled server (npm run build:server); scripts/test.sh and e2e-only.sh build it.
    command: "node --enable-source-maps dist/server.js",
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    gracefulShutdown: { signal: "SIGTERM", timeout: 5_000 },
    env: {
      NODE_ENV: "production",
      PORT: String(PORT),
      NEXTAUTH_URL: baseURL,
      DATABASE_URL: process.env.E2E_DATABASE_URL ?? "postgres://app@127.0.0.1:54329/getterline_e2e",
      SMTP_PORT: "2525",
      MAIL_CATCHER_URL: "http://127.0.0.1:2580",
      S3_ENDPOINT: "http://127.0.0.1:4589",
      STRIPE_API_PORT: "12121",
    },
  },
});
