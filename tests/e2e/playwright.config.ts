import { defineConfig } from "@playwright/test";

export default defineConfig({
  testDir: ".",
  testMatch: /.*\.spec\.ts$/,
  timeout: 60_000,
  retries: 0,
  workers: 1,
  outputDir: "../.artifacts/playwright",
  reporter: [["list"], ["json"]],
  use: {
    baseURL: process.env.JIGBOARD_TEST_URL ?? "http://127.0.0.1:3100",
    viewport: { width: 1440, height: 900 },
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    },
    trace: "off",
  },
});
