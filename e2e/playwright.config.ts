import { defineConfig } from '@playwright/test';

const baseURL = 'http://127.0.0.1:4173';

export default defineConfig({
  testDir: '.',
  testMatch: '*.spec.ts',
  outputDir: '../test-results',
  workers: 1,
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
    command: 'npm run preview -w @linewright/web',
    cwd: '..',
    url: baseURL,
    reuseExistingServer: false,
    timeout: 30_000,
  },
});
