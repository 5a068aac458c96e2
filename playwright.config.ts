import { defineConfig, devices } from '@playwright/test'

// Started by scripts/test.mjs, which serves the built app and passes its URL.
const baseURL = process.env.RIMECASE_TEST_BASE_URL ?? 'http://127.0.0.1:3000'

export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  timeout: 60_000,
  expect: { timeout: 10_000 },
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  reporter: [['list']],
  // The app's service worker is kept out of every test but the offline ones (which allow it), so no
  // test ever runs against a copy of the app cached by an earlier build.
  use: { baseURL, headless: true, trace: 'off', serviceWorkers: 'block' },
  projects: [
    {
      name: 'debian-chromium',
      use: {
        ...devices['Desktop Chrome'],
        launchOptions: {
          executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
          args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking',
            '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
        },
      },
    },
  ],
})
