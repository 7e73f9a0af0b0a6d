import { defineConfig } from '@playwright/test';

// The test runner (server/dev/bootstrap.js test) starts the built server against a throwaway
// database and passes its address in PARALLAX_E2E_URL. Debian's chromium is used; nothing is downloaded.
export default defineConfig({
  testDir: '.',
  testMatch: '**/*.e2e.ts',
  outputDir: '../.test-output/e2e-results',
  workers: 1,
  retries: 0,
  timeout: 90_000,
  expect: { timeout: 15_000 },
  reporter: [['list'], ['json', { outputFile: '../.test-output/e2e.json' }]],
  use: {
    baseURL: process.env.PARALLAX_E2E_URL ?? 'http://127.0.0.1:3000',
    viewport: { width: 1366, height: 768 },
    trace: 'off',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
        '--disable-background-networking', '--disable-component-update', '--disable-sync',
      ],
    },
  },
});
