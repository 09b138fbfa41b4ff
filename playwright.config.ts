import { defineConfig, devices } from '@playwright/test';

// scripts/test.mjs builds the app and sets these; the web server below gets them as they are.
const E2E_PORT = Number(process.env.E2E_PORT ?? 3100);
const BASE_URL = `http://127.0.0.1:${E2E_PORT}`;

const PASSED_ENV = [
  'DATABASE_URL',
  'SMTP_URL',
  'MAILDEV_WEB_URL',
  'NEXTAUTH_SECRET',
  'NEXTAUTH_URL',
  'APP_URL',
  'MAIL_FROM',
] as const;

function serverEnv(): Record<string, string> {
  const env: Record<string, string> = {
    NODE_ENV: 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    // The e2e app only: tests move its clock through app_meta (tests/e2e/test-clock.ts) instead of sleeping,
    // and the reminder worker looks every second so a moved clock shows up as mail within moments.
    KERFLINE_TEST_CLOCK: '1',
    REMINDER_POLL_MS: '1000',
  };
  for (const name of PASSED_ENV) {
    const value = process.env[name];
    if (value !== undefined) env[name] = value;
  }
  return env;
}

// Debian's Chromium (apt-get install chromium): Playwright downloads no browser here.
const launchOptions = {
  executablePath: '/usr/bin/chromium',
  args: [
    '--disable-gpu',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--no-first-run',
    '--disable-quic',
    // Without it Chromium still looks up outside hosts.
    '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE localhost, EXCLUDE 127.0.0.1',
  ],
};

export default defineConfig({
  testDir: 'tests/e2e',
  fullyParallel: false,
  // Two cores and one shared server and database.
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [['list'], ['json', { outputFile: '.reports/playwright.json' }]],
  outputDir: 'test-results',
  use: {
    baseURL: BASE_URL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions,
  },
  projects: [
    // Signs each demo role in once and saves its cookies for the `signedIn` fixture (tests/e2e/fixtures.ts).
    { name: 'sign-in', testMatch: /.*\.setup\.ts$/, use: { ...devices['Desktop Chrome'], launchOptions } },
    {
      name: 'chromium',
      dependencies: ['sign-in'],
      // Spread the device first, then restate launchOptions so nothing from it replaces ours.
      use: { ...devices['Desktop Chrome'], launchOptions },
    },
  ],
  webServer: {
    command: `node node_modules/next/dist/bin/next start -H 127.0.0.1 -p ${E2E_PORT}`,
    url: `${BASE_URL}/sign-in`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'pipe',
    stderr: 'pipe',
    env: serverEnv(),
  },
});
