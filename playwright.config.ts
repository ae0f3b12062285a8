import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { defineConfig } from "@playwright/test";

// The app under test runs on a fresh data folder with the demo data, like `npm start` does.
const port = Number(process.env.E2E_PORT ?? 3199);
const dataDir = process.env.E2E_DATA_DIR ?? mkdtempSync(path.join(os.tmpdir(), "blendwell-e2e-"));
process.env.E2E_DATA_DIR = dataDir; // workers re-read this config: keep one folder

export default defineConfig({
  testDir: "tests/e2e",
  outputDir: "test-results/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  reporter: [["list"]],
  use: {
    baseURL: `http://localhost:${port}`,
    screenshot: "only-on-failure",
    trace: "off",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
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
  webServer: {
    command: "npx tsx server/index.ts",
    url: `http://localhost:${port}/api/health`,
    reuseExistingServer: false,
    // The first start posts the demo strips through the real analysis.
    timeout: 240_000,
    stdout: "ignore",
    stderr: "pipe",
    env: {
      PORT: String(port),
      DATA_DIR: dataDir,
      APP_URL: `http://localhost:${port}`,
      DEMO_MODE: "true",
      LOG_LEVEL: "warn",
      RATE_LIMIT_MULTIPLIER: "20",
    },
  },
});
