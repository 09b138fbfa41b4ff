#!/usr/bin/env node
// `npm test`: typecheck, lint, Vitest unit + integration, the build, the Vitest system projects (they run
// the built app, on disk and on S3) and Playwright, each run even when an earlier one failed; ends with one line
// `N passed, N failed[, N skipped]` and a matching exit code.
//   --unit     typecheck, lint and the Vitest `unit` project only (no database, no browser)
//   --no-e2e   everything but Playwright (also KERFLINE_SKIP_E2E=1)
import fs from 'node:fs';
import path from 'node:path';
import { ensureBuild } from './lib/build.mjs';
import { INTEGRATION_DEB_PACKAGES, START_DEB_PACKAGES, TEST_DEB_PACKAGES, ensureDebPackages, ensureNodeModules } from './lib/install.mjs';
import { addCleanup, handleSignals, teardown } from './lib/lifecycle.mjs';
import { TEST_MAIL_PORTS, ensureMaildev } from './lib/maildev.mjs';
import { databaseUrl, ensureDataRoot, ensurePostgres, recreateDatabase, runDbSetup } from './lib/postgres.mjs';
import { ROOT, childEnv, log, run, warn } from './lib/proc.mjs';
import { randomSecret } from './lib/secret.mjs';
import { ensureSwift } from './lib/swift.mjs';
import {
  addCounts,
  emptyCounts,
  playwrightCounts,
  playwrightFailures,
  readJsonReport,
  runnerCounts,
  summaryLine,
  vitestCounts,
  vitestFailures,
} from './lib/summary.mjs';

const args = process.argv.slice(2);
const UNIT_ONLY = args.includes('--unit');
const SKIP_E2E = UNIT_ONLY || args.includes('--no-e2e') || process.env.KERFLINE_SKIP_E2E === '1';
const E2E_PORT = Number(process.env.E2E_PORT || 3100);
const APP_URL = `http://127.0.0.1:${E2E_PORT}`;
const REPORTS = path.join(ROOT, '.reports');
const VITEST_REPORT = path.join(REPORTS, 'vitest.json');
const VITEST_SYSTEM_REPORT = path.join(REPORTS, 'vitest-system.json');
const PLAYWRIGHT_REPORT = path.join(REPORTS, 'playwright.json');
const MAIL_FROM = 'Kerfline <no-reply@kerfline.local>';
const bin = (rel) => path.join(ROOT, 'node_modules', rel);

const total = emptyCounts();
const failedSteps = [];
const failedTests = [];

function fail(step, count = 1) {
  failedSteps.push(step);
  total.failed += count;
}

function heading(title) {
  process.stdout.write(`\n===== ${title} =====\n`);
}

// Tools pick their own NODE_ENV (Vitest: test); an inherited one would confuse them.
const toolEnv = (extra = {}) => childEnv({ NODE_ENV: undefined, ...extra });

/**
 * Installs, then brings up PostgreSQL with fresh test databases, the test mail catcher and Swift (the
 * S3-compatible server). kerfline_it_s3 belongs to the tests that run app processes on S3 with their
 * background workers on, so those workers never pick up the disk-backed tests' clips.
 */
async function setUpServices() {
  const pg = await ensurePostgres();
  addCleanup('PostgreSQL', pg.stop);
  const urls = { it: databaseUrl(pg.port, 'kerfline_it'), s3: databaseUrl(pg.port, 'kerfline_it_s3'), e2e: databaseUrl(pg.port, 'kerfline_e2e') };
  for (const name of ['kerfline_it', 'kerfline_it_s3', 'kerfline_e2e']) {
    log(`recreating database ${name}`);
    await recreateDatabase(pg, name);
  }
  for (const url of Object.values(urls)) await runDbSetup(url);
  const mail = await ensureMaildev({ ...TEST_MAIL_PORTS, logFile: path.join(ROOT, '.data', 'maildev-test.log') });
  addCleanup('maildev', mail.stop);
  log(`test mail catcher: ${mail.webUrl}`);
  const swift = await ensureSwift({ fresh: true });
  addCleanup('Swift', swift.stop);
  log(`test S3 server (Swift s3api): ${swift.endpoint}, bucket ${swift.bucket}`);
  return { urls, mail, swift };
}

function testEnv(dbUrl, services, secret) {
  return {
    DATABASE_URL: dbUrl,
    KERFLINE_S3_DATABASE_URL: services.urls.s3,
    ...services.swift.env,
    // Source: @aws-sdk/core emitWarningIfUnsupportedVersion (the Node 22 notice, once per process, in every app the tests start).
    AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
    SMTP_URL: services.mail.smtpUrl,
    MAILDEV_WEB_URL: services.mail.webUrl,
    NEXTAUTH_SECRET: secret,
    NEXTAUTH_URL: APP_URL,
    APP_URL,
    MAIL_FROM,
  };
}

async function typecheck() {
  heading('typecheck (tsc --noEmit)');
  // Route types and next-env.d.ts come from Next; without them a fresh clone fails tsc.
  const typegen = await run(process.execPath, [bin('next/dist/bin/next'), 'typegen'], { env: toolEnv(), capture: true });
  if (typegen.code !== 0) warn(`next typegen failed (exit ${typegen.code}); typechecking anyway\n${typegen.stderr.trim()}`);
  const result = await run(process.execPath, [bin('typescript/bin/tsc'), '--noEmit'], { env: toolEnv() });
  if (result.code !== 0) fail('typecheck');
}

async function lint() {
  heading('lint (eslint --max-warnings=0 .)');
  const result = await run(process.execPath, [bin('eslint/bin/eslint.js'), '--max-warnings=0', '.'], { env: toolEnv() });
  if (result.code !== 0) fail('lint');
}

/** Runs the named Vitest projects into one JSON report and adds its counts to the total. */
async function vitest(env, projects, report, extraArgs = []) {
  heading(`vitest (${projects.join(' + ')})`);
  const vitestArgs = ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${path.relative(ROOT, report)}`, ...extraArgs];
  for (const project of projects) vitestArgs.push('--project', project);
  const result = await run(process.execPath, [bin('vitest/vitest.mjs'), ...vitestArgs], { env: toolEnv(env) });
  tally('Vitest', report, result.code, vitestCounts, (json) => vitestFailures(json, ROOT));
}

/** Adds one runner's report to the total, and names its failed tests for the closing lines. */
function tally(runner, file, exitCode, countsOf, failuresOf) {
  const report = readJsonReport(file);
  const counts = runnerCounts(report, countsOf, exitCode);
  if (counts.missing) warn(`${runner} wrote no report: counted as 1 failed`);
  addCounts(total, counts);
  if (!counts.failed) return;
  failedSteps.push(runner.toLowerCase());
  if (report) failedTests.push(...failuresOf(report));
}

async function build(env) {
  heading('build (next build)');
  const result = await ensureBuild({ env });
  if (!result.ok) fail('build (upload and end-to-end tests not run against it)');
  return result.ok;
}

async function e2e(env) {
  heading('playwright');
  const result = await run(process.execPath, [bin('@playwright/test/cli.js'), 'test'], {
    env: toolEnv({ ...env, E2E_PORT: String(E2E_PORT) }),
  });
  tally('Playwright', PLAYWRIGHT_REPORT, result.code, playwrightCounts, playwrightFailures);
}

async function install() {
  await ensureDebPackages(UNIT_ONLY ? START_DEB_PACKAGES : SKIP_E2E ? INTEGRATION_DEB_PACKAGES : TEST_DEB_PACKAGES);
  await ensureNodeModules();
  ensureDataRoot();
}

function resetReports() {
  fs.mkdirSync(REPORTS, { recursive: true });
  for (const file of [VITEST_REPORT, VITEST_SYSTEM_REPORT, PLAYWRIGHT_REPORT]) fs.rmSync(file, { force: true });
}

async function main() {
  handleSignals({ exitCode: 130 });
  await install();
  resetReports();
  const secret = randomSecret();
  let services = null;
  if (!UNIT_ONLY) {
    try {
      services = await setUpServices();
    } catch (error) {
      warn(`test services could not be set up: ${error.message}`);
      fail('services (integration and end-to-end tests not run)');
    }
  }
  await typecheck();
  await lint();
  if (!services) {
    await vitest({ NEXTAUTH_SECRET: secret, NEXTAUTH_URL: APP_URL, APP_URL, MAIL_FROM }, ['unit'], VITEST_REPORT);
    return;
  }
  const itEnv = testEnv(services.urls.it, services, secret);
  // Unit and integration tests need no build; only the system projects (disk and S3) and Playwright run the built app.
  await vitest(itEnv, ['unit', 'integration'], VITEST_REPORT);
  const built = await build({ ...testEnv(services.urls.e2e, services, secret), NEXT_TELEMETRY_DISABLED: '1' });
  // One file at a time: each starts its own `next start` processes, and two cores cannot run them all at once.
  if (built) await vitest(itEnv, ['system', 'storage-s3'], VITEST_SYSTEM_REPORT, ['--no-file-parallelism']);
  if (built && !SKIP_E2E) await e2e({ ...testEnv(services.urls.e2e, services, secret), NEXT_TELEMETRY_DISABLED: '1' });
}

async function finish(code) {
  await teardown();
  if (failedTests.length) process.stdout.write(`\nFailed tests:\n${failedTests.map((t) => `  ${t}`).join('\n')}\n`);
  if (failedSteps.length) process.stdout.write(`\nFailed: ${failedSteps.join(', ')}\n`);
  process.stdout.write(`${summaryLine(total)}\n`);
  process.exit(code || (total.failed > 0 ? 1 : 0));
}

main().then(
  () => finish(0),
  async (error) => {
    process.stderr.write(`\nkerfline> ${error.stack ?? error}\n`);
    if (total.failed === 0) total.failed = 1;
    await finish(1);
  },
);
