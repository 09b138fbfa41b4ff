// Installs what the project needs from Debian and npm, only when missing.
import fs from 'node:fs';
import path from 'node:path';
import { ROOT, SetupError, childEnv, isRoot, log, output, run, sleep, warn } from './proc.mjs';

/** Debian packages `npm start` needs. Extend here when the app needs more system tools. */
// ffmpeg: ffprobe reads a clip's duration, resolution and codec, ffmpeg makes its poster frame.
export const START_DEB_PACKAGES = ['postgresql', 'ffmpeg'];

// OpenStack Swift with s3api: the S3-compatible server the S3 clip store is tested against (npm test only).
export const SWIFT_DEB_PACKAGES = ['swift', 'swift-proxy', 'swift-object', 'swift-container', 'swift-account', 'memcached'];

/** `npm test` without the browser: everything start needs, plus Swift for the S3 clip store tests. */
// python3-icalendar: a second, independent reader of the calendar feed in tests/integration/calendar-feed.test.ts
// (one small package; its dependencies come with Debian's python3).
export const INTEGRATION_DEB_PACKAGES = [...START_DEB_PACKAGES, ...SWIFT_DEB_PACKAGES, 'python3-icalendar'];

/** `npm test` needs all of that, plus a browser for Playwright (/usr/bin/chromium). */
export const TEST_DEB_PACKAGES = [...INTEGRATION_DEB_PACKAGES, 'chromium'];

const APT_RETRIES = 4;
const APT_RETRY_PAUSE_MS = 15_000;
// apt waits this long for a dpkg lock held by another apt run before it gives up.
const APT_LOCK_TIMEOUT_S = 300;

async function debInstalled(name) {
  const status = await output('dpkg-query', ['-W', '-f=${Status}', name]);
  return status !== null && status.includes('install ok installed');
}

/** The names in `names` that dpkg does not report as installed; null when this is not Debian. */
export async function missingDebPackages(names) {
  if ((await output('dpkg-query', ['--version'])) === null) return null;
  const missing = [];
  for (const name of names) if (!(await debInstalled(name))) missing.push(name);
  return missing;
}

const isLockError = (text) => /Could not get lock|dpkg frontend lock|Unable to acquire the dpkg|is another process using it/i.test(text);

async function aptGet(args) {
  const env = childEnv({ DEBIAN_FRONTEND: 'noninteractive' });
  const fullArgs = ['-o', `DPkg::Lock::Timeout=${APT_LOCK_TIMEOUT_S}`, ...args];
  let result;
  for (let attempt = 1; attempt <= APT_RETRIES; attempt++) {
    result = await run('apt-get', fullArgs, { env, tee: true });
    if (result.code === 0 || !isLockError(result.stdout + result.stderr)) return result;
    warn(`dpkg is locked by another process; retrying in ${APT_RETRY_PAUSE_MS / 1000}s (${attempt}/${APT_RETRIES})`);
    await sleep(APT_RETRY_PAUSE_MS);
  }
  return result;
}

/** Installs missing Debian packages with apt-get when root; otherwise says what to run and fails. */
export async function ensureDebPackages(names) {
  const missing = await missingDebPackages(names);
  if (missing === null) {
    warn(`dpkg-query not found: cannot check for ${names.join(', ')}; install them yourself if missing`);
    return;
  }
  if (missing.length === 0) return;
  if (!isRoot()) {
    throw new SetupError(`missing system packages. Run:\n  sudo apt-get install -y ${missing.join(' ')}\nthen try again.`);
  }
  log(`installing Debian packages: ${missing.join(' ')}`);
  const install = ['install', '-y', '--no-install-recommends', ...missing];
  let result = await aptGet(install);
  if (result.code !== 0) {
    // Usually an empty or stale package list on a fresh machine.
    log('apt-get install failed; running apt-get update and trying again');
    await aptGet(['update']);
    result = await aptGet(install);
  }
  if (result.code !== 0) throw new SetupError(`apt-get install ${missing.join(' ')} failed (exit ${result.code})`);
  const still = await missingDebPackages(missing);
  if (still?.length) throw new SetupError(`still not installed after apt-get: ${still.join(', ')}`);
}

function mtimeMs(file) {
  try {
    return fs.statSync(file).mtimeMs;
  } catch {
    return null;
  }
}

/** True when node_modules is missing or older than package-lock.json. */
export function nodeModulesStale(root = ROOT) {
  const installed = mtimeMs(path.join(root, 'node_modules', '.package-lock.json'));
  const lock = mtimeMs(path.join(root, 'package-lock.json'));
  if (installed === null) return true;
  return lock !== null && lock > installed;
}

/** `npm ci` when needed. Dev and optional dependencies always (tests need the former, SWC the latter). */
export async function ensureNodeModules(root = ROOT) {
  if (!nodeModulesStale(root)) return;
  log('installing npm packages (npm ci)');
  const npm = process.env.npm_execpath;
  const [cmd, args] = npm && npm.endsWith('.js') ? [process.execPath, [npm]] : ['npm', []];
  const result = await run(cmd, [...args, 'ci', '--include=dev', '--include=optional', '--no-audit', '--no-fund'], {
    cwd: root,
    env: childEnv({ NODE_ENV: undefined }),
  });
  if (result.code !== 0) throw new SetupError(`npm ci failed (exit ${result.code})`);
}
