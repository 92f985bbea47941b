import { defineConfig } from '@playwright/test';

// The tests serve on a port of their own (E2E_PORT, default 4174), so `npm test` can run while
// `npm start` serves the editor on 4173, and several checkouts can test side by side.
const port = Number(process.env.E2E_PORT ?? 4174);
const baseURL = `http://127.0.0.1:${port}`;

export default defineConfig({
  testDir: '.',
  testMatch: '*.spec.ts',
  outputDir: '../test-results',
  workers: 1,
  // On the shared 2-core CI machine a browser test can lose a race to the load; one retry there, and the
  // list reporter names every test that needed it as "flaky" so it is still seen and fixed.
  retries: process.env.CI ? 1 : 0,
  timeout: 120_000,
  expect: { timeout: 5_000 },
  reporter: [['list']],
  use: {
    baseURL,
    browserName: 'chromium',
    viewport: { width: 1440, height: 900 },
    acceptDownloads: true,
    actionTimeout: 10_000,
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: ['--disable-gpu', '--disable-quic'],
    },
  },
  webServer: {
    command: `npm run preview -w @linewright/web -- --port ${port}`,
    cwd: '..',
    url: baseURL,
    reuseExistingServer: false,
    timeout: 30_000,
  },
});
