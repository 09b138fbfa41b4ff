// `next build` only when the sources changed since the last build.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { ROOT, childEnv, log, run } from './proc.mjs';

/** Folders whose every file feeds the build (missing ones are skipped). */
export const BUILD_INPUT_DIRS = ['app', 'components', 'lib', 'db', 'storage', 'public', 'styles', 'types'];

/** Single files that feed the build (missing ones are skipped). */
export const BUILD_INPUT_FILES = [
  'next.config.mjs',
  'next.config.ts',
  'tailwind.config.ts',
  'postcss.config.mjs',
  'tsconfig.json',
  'package-lock.json',
  'middleware.ts',
  'proxy.ts',
  'instrumentation.ts',
];

export const STAMP_FILE = path.join('.next', 'kerfline-build-stamp');

function walk(root, relDir, out) {
  let entries;
  try {
    entries = fs.readdirSync(path.join(root, relDir), { withFileTypes: true });
  } catch {
    return;
  }
  for (const entry of entries) {
    const rel = path.posix.join(relDir, entry.name);
    if (entry.isDirectory()) walk(root, rel, out);
    else out.push(rel);
  }
}

/** "path size mtime" for every build input, sorted so the order of readdir does not matter. */
export function fingerprintEntries(root = ROOT) {
  const files = [];
  for (const dir of BUILD_INPUT_DIRS) walk(root, dir, files);
  for (const file of BUILD_INPUT_FILES) if (fs.existsSync(path.join(root, file))) files.push(file);
  return files.sort().map((rel) => {
    const stat = fs.lstatSync(path.join(root, rel));
    return `${rel}\t${stat.size}\t${Math.trunc(stat.mtimeMs)}`;
  });
}

export function buildFingerprint(root = ROOT, entries = fingerprintEntries(root)) {
  return crypto.createHash('sha256').update(entries.join('\n')).digest('hex');
}

function readStamp(root) {
  try {
    return fs.readFileSync(path.join(root, STAMP_FILE), 'utf8').trim();
  } catch {
    return null;
  }
}

/** Settings read at build time: next.config.mjs adds HSTS only for an https NEXTAUTH_URL. */
export const buildEnvEntries = (env = {}) => [`env:NEXTAUTH_URL https\t${String(env.NEXTAUTH_URL ?? '').startsWith('https://')}`];

/** True when .next holds a build made from the current sources (and build-time settings). */
export function buildIsCurrent(root = ROOT, env = {}) {
  if (!fs.existsSync(path.join(root, '.next', 'BUILD_ID'))) return false;
  return readStamp(root) === buildFingerprint(root, [...fingerprintEntries(root), ...buildEnvEntries(env)]);
}

// The first `next build` rewrites tsconfig.json; that change alone should not force another build.
function stampAfterBuild(root, before, env) {
  const after = [...fingerprintEntries(root), ...buildEnvEntries(env)];
  const changed = new Set([...before.filter((e) => !after.includes(e)), ...after.filter((e) => !before.includes(e))]);
  const onlyTsconfig = [...changed].every((entry) => entry.startsWith('tsconfig.json\t'));
  return buildFingerprint(root, onlyTsconfig ? after : before);
}

/**
 * Runs `next build` unless the build is current. `env` is the build's environment (NODE_ENV is
 * forced to production). Resolves { ok, built, code }.
 */
export async function ensureBuild({ root = ROOT, env = {}, force = false } = {}) {
  if (!force && buildIsCurrent(root, env)) {
    log('build is up to date (.next)');
    return { ok: true, built: false, code: 0 };
  }
  log('building the app (next build)');
  const before = [...fingerprintEntries(root), ...buildEnvEntries(env)];
  const result = await run(process.execPath, [path.join(root, 'node_modules/next/dist/bin/next'), 'build'], {
    cwd: root,
    env: childEnv({ ...env, NODE_ENV: 'production' }),
  });
  if (result.code !== 0) {
    fs.rmSync(path.join(root, STAMP_FILE), { force: true });
    return { ok: false, built: false, code: result.code };
  }
  fs.writeFileSync(path.join(root, STAMP_FILE), `${stampAfterBuild(root, before, env)}\n`);
  return { ok: true, built: true, code: 0 };
}
