#!/usr/bin/env node
// `npm start` / `npm run dev`: install what is missing, start PostgreSQL and the mail catcher,
// build if needed, serve the app on 127.0.0.1, and stop everything again on Ctrl-C.
import fs from 'node:fs';
import path from 'node:path';
import { ensureBuild } from './lib/build.mjs';
import { START_DEB_PACKAGES, ensureDebPackages, ensureNodeModules } from './lib/install.mjs';
import { addCleanup, handleSignals, isShuttingDown, teardown } from './lib/lifecycle.mjs';
import { ensureMaildev, mailPorts } from './lib/maildev.mjs';
import { databaseUrl, ensureDataRoot, ensureDatabase, ensurePostgres, runDbSetup } from './lib/postgres.mjs';
import { ROOT, SetupError, childEnv, httpAnswers, log, startService, stopService, waitFor } from './lib/proc.mjs';
import { publicUrls } from './lib/public-url.mjs';
import { ensureSessionSecret } from './lib/secret.mjs';

const DEV = process.argv.includes('--dev');
const APP_PORT = Number(process.env.PORT || 3000);
// The operator's NEXTAUTH_URL / APP_URL win (https makes cookies Secure and adds HSTS); the app
// itself always listens on 127.0.0.1, which is where this script checks that it answers.
const URLS = publicUrls(process.env, APP_PORT);
const APP_URL = URLS.localUrl;
const DB_NAME = 'kerfline';
const MAIL_FROM = 'Kerfline <no-reply@kerfline.local>';
const DEMO_ACCOUNTS = path.join(ROOT, 'db', 'seeds', 'demo-accounts.json');

async function startDatabase() {
  const pg = await ensurePostgres();
  addCleanup('PostgreSQL', pg.stop);
  await ensureDatabase(pg, DB_NAME);
  const url = databaseUrl(pg.port, DB_NAME);
  await runDbSetup(url);
  return url;
}

async function startMailCatcher() {
  const mail = await ensureMaildev({ ...mailPorts(), logFile: path.join(ROOT, '.data', 'maildev.log') });
  addCleanup('maildev', mail.stop);
  log(`Mail catcher: ${mail.webUrl}`);
  return mail;
}

function appEnv({ dbUrl, mail, secret }) {
  return {
    DATABASE_URL: dbUrl,
    NEXTAUTH_SECRET: secret,
    NEXTAUTH_URL: URLS.nextAuthUrl,
    APP_URL: URLS.appUrl,
    SMTP_URL: mail.smtpUrl,
    MAILDEV_WEB_URL: mail.webUrl,
    MAIL_FROM,
    NEXT_TELEMETRY_DISABLED: '1',
  };
}

function readDemoAccounts() {
  try {
    const accounts = JSON.parse(fs.readFileSync(DEMO_ACCOUNTS, 'utf8'));
    return Array.isArray(accounts) ? accounts : [];
  } catch {
    return [];
  }
}

function printReady(mail) {
  const lines = ['', `Kerfline is running: ${URLS.nextAuthUrl}${URLS.nextAuthUrl === APP_URL ? '' : ` (listening on ${APP_URL})`}`, `Mail catcher:       ${mail.webUrl}`];
  const accounts = readDemoAccounts();
  if (accounts.length) {
    lines.push('', 'Sign in with (demo accounts):');
    for (const a of accounts) lines.push(`  ${a.email} / ${a.password}  ${a.name ?? ''}${a.role ? ` (${a.role})` : ''}`);
  }
  lines.push('', 'Press Ctrl-C to stop.', '');
  process.stdout.write(`${lines.join('\n')}\n`);
}

function startApp(env) {
  const next = path.join(ROOT, 'node_modules/next/dist/bin/next');
  const args = [next, DEV ? 'dev' : 'start', '-H', '127.0.0.1', '-p', String(APP_PORT)];
  const nodeEnv = DEV ? 'development' : 'production';
  log(`starting the app (next ${DEV ? 'dev' : 'start'}) on ${APP_URL}`);
  const app = startService('next', process.execPath, args, { env: childEnv({ ...env, NODE_ENV: nodeEnv }) });
  addCleanup('app', () => stopService(app));
  return app;
}

async function main() {
  handleSignals({ exitCode: 0 });
  await ensureDebPackages(START_DEB_PACKAGES);
  await ensureNodeModules();
  ensureDataRoot();
  const dbUrl = await startDatabase();
  const mail = await startMailCatcher();
  const env = appEnv({ dbUrl, mail, secret: ensureSessionSecret() });
  if (!DEV) {
    const build = await ensureBuild({ env });
    if (!build.ok) throw new SetupError(`next build failed (exit ${build.code})`);
  }
  if (await httpAnswers(APP_URL)) throw new SetupError(`port ${APP_PORT} is already in use; set PORT to another one`);
  const app = startApp(env);
  const up = await waitFor(() => httpAnswers(APP_URL, 30_000), {
    timeoutMs: DEV ? 300_000 : 120_000,
    intervalMs: 500,
    abort: () => app.exited,
  });
  if (!up) throw new SetupError(app.exited ? `the app exited (code ${app.code})` : `the app did not answer on ${APP_URL}`);
  printReady(mail);
  await app.exit;
  if (isShuttingDown()) return;
  throw new SetupError(`the app stopped unexpectedly (${app.signal ?? `exit ${app.code}`})`);
}

main().catch(async (error) => {
  // A signal is tearing things down already; the failure is its doing and it will exit.
  if (isShuttingDown()) return;
  process.stderr.write(`\nkerfline> ${error instanceof SetupError ? error.message : error.stack}\n`);
  await teardown();
  process.exit(1);
});
