/** Playwright: Debian's chromium (never a downloaded browser) against a production `next start` on :3100. */
import { defineConfig } from "@playwright/test";

const port = 3100;
const env = {
  DB_HOST: "127.0.0.1",
  DB_PORT: process.env.DB_PORT ?? "3408",
  DB_NAME: process.env.DB_NAME ?? "sixfold_e2e",
  DB_USER: process.env.DB_USER ?? "sixfold",
  DB_PASSWORD: process.env.DB_PASSWORD ?? "sixfold-test",
  NEXTAUTH_URL: `http://localhost:${port}`,
  NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? "test-secret-not-for-production",
  NEXT_TELEMETRY_DISABLED: "1",
  SMTP_PORT: process.env.SMTP_PORT ?? "2526",
  MAIL_CAPTURE_FILE: process.env.MAIL_CAPTURE_FILE ?? ".data/mail/test-captured.jsonl",
};
Object.assign(process.env, env);

export default defineConfig({
  testDir: "tests/e2e",
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  outputDir: ".data/results/playwright-artifacts",
  globalSetup: "./tests/e2e/global-setup.ts",
  use: {
    baseURL: `http://localhost:${port}`,
    // API calls made through page.request carry the Origin a browser would send (the CSRF guard checks it)
    extraHTTPHeaders: { origin: `http://localhost:${port}` },
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: [
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
  projects: [{ name: "chromium", use: { browserName: "chromium" } }],
  webServer: {
    command: `node_modules/.bin/next start -p ${port} -H 127.0.0.1`,
    url: `http://localhost:${port}/signin`,
    timeout: 60_000,
    reuseExistingServer: false,
    env,
  },
});
