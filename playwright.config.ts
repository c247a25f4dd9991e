import { defineConfig } from "@playwright/test";
import { SERVER_NODE_FLAGS } from "./scripts/server-flags.mjs";

const port = Number(process.env.E2E_PORT ?? 4322);
const baseURL = `http://127.0.0.1:${port}`;

export default defineConfig({
  testDir: "tests/e2e",
  workers: 1,
  fullyParallel: false,
  retries: 0,
  timeout: 30_000,
  expect: { timeout: 7_000 },
  reporter: process.env.CI_REPORT_JSON ? [["list"], ["json", { outputFile: process.env.CI_REPORT_JSON }]] : [["list"]],
  use: {
    baseURL,
    browserName: "chromium",
    trace: "off",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: ["--disable-gpu", "--disable-sync", "--disable-background-networking", "--disable-component-update", "--no-first-run", "--disable-quic"],
    },
  },
  webServer: {
    command: `node ${SERVER_NODE_FLAGS.join(" ")} scripts/server.mjs`,
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    stdout: "ignore",
    stderr: "pipe",
    env: {
      ...(process.env as Record<string, string>),
      HOST: "127.0.0.1",
      PORT: String(port),
      BETTER_AUTH_URL: baseURL,
      NODE_ENV: "production",
      // The matrix alone starts about thirty deliveries in the demo organisation (sessions and API keys); the
      // hourly limit itself is tested in tests/server/deliveries.test.ts.
      DELIVERY_RATE_LIMIT: process.env.DELIVERY_RATE_LIMIT ?? "200",
    },
  },
});
