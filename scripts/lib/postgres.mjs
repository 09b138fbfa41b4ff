// A project-local PostgreSQL cluster: created once, started on demand, shared by start and test.
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ROOT, SetupError, childEnv, isRoot, log, output, run, tailFile, waitFor, warn } from './proc.mjs';

export const DEFAULT_PG_PORT = 54329;
const PG_USER = 'postgres';
// Unix socket paths are limited to 107 bytes on Linux.
const MAX_SOCKET_PATH = 100;

export const pgPort = () => Number(process.env.KERFLINE_PG_PORT || DEFAULT_PG_PORT);

export const databaseUrl = (port, name) => `postgres://${PG_USER}@127.0.0.1:${port}/${name}`;

export const dataRoot = (root = ROOT) => path.join(root, '.data');

/** .data exists and is traversable by others (the postgres user must reach .data/postgres). */
export function ensureDataRoot(root = ROOT) {
  const dir = dataRoot(root);
  fs.mkdirSync(dir, { recursive: true });
  fs.chmodSync(dir, 0o755);
  return dir;
}

function newestVersionedBinDir() {
  const base = '/usr/lib/postgresql';
  let versions = [];
  try {
    versions = fs.readdirSync(base).filter((v) => fs.existsSync(path.join(base, v, 'bin', 'pg_ctl')));
  } catch {
    return null;
  }
  versions.sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

/** Server binaries: the data dir's own major version if present, else pg_config, else the newest. */
export async function pgBinDir(dataDir) {
  const clusterVersion = readFileOrNull(path.join(dataDir ?? '', 'PG_VERSION'))?.trim();
  const own = clusterVersion && `/usr/lib/postgresql/${clusterVersion}/bin`;
  if (own && fs.existsSync(path.join(own, 'pg_ctl'))) return own;
  const fromConfig = await output('pg_config', ['--bindir']);
  if (fromConfig && fs.existsSync(path.join(fromConfig, 'pg_ctl'))) return fromConfig;
  const newest = newestVersionedBinDir();
  if (newest) return newest;
  throw new SetupError('PostgreSQL server binaries not found (pg_ctl). Install the postgresql package.');
}

function readFileOrNull(file) {
  try {
    return fs.readFileSync(file, 'utf8');
  } catch {
    return null;
  }
}

const shellQuote = (s) => `'${String(s).replaceAll("'", `'\\''`)}'`;

/** Runs a server binary as the postgres user when we are root (initdb/postgres refuse root). */
function runServerTool(bin, args, options = {}) {
  if (isRoot()) return run('runuser', ['-u', PG_USER, '--', bin, ...args], { cwd: '/', ...options });
  return run(bin, args, options);
}

async function postgresCanReach(dir) {
  const result = await run('runuser', ['-u', PG_USER, '--', 'test', '-x', dir], { capture: true, cwd: '/' });
  return result.code === 0;
}

function unreachableAncestor(dir) {
  let current = path.dirname(dir);
  let found = null;
  while (current !== path.dirname(current)) {
    const mode = fs.statSync(current).mode;
    if ((mode & 0o001) === 0) found = current;
    current = path.dirname(current);
  }
  return found;
}

/**
 * Where the cluster lives: KERFLINE_PG_DATA, else .data/postgres. As root, when the postgres user
 * cannot reach the repository (a parent folder without o+x, e.g. under /root), it falls back to a
 * folder under /var/lib/kerfline keyed by the repository path, so data still persists across runs.
 */
export async function resolveDataDir(root = ROOT) {
  if (process.env.KERFLINE_PG_DATA) return path.resolve(process.env.KERFLINE_PG_DATA);
  const preferred = path.join(ensureDataRoot(root), 'postgres');
  if (!isRoot() || (await postgresCanReach(dataRoot(root)))) return preferred;
  const key = crypto.createHash('sha256').update(root).digest('hex').slice(0, 12);
  const fallback = path.join('/var/lib/kerfline', key, 'postgres');
  const blocker = unreachableAncestor(dataRoot(root));
  warn(
    `the postgres user cannot reach ${dataRoot(root)}` +
      (blocker ? ` (${blocker} has no execute permission for others; "chmod o+x ${blocker}" would fix it)` : '') +
      `. Keeping the database in ${fallback} instead (set KERFLINE_PG_DATA to choose).`,
  );
  fs.mkdirSync(path.dirname(fallback), { recursive: true, mode: 0o755 });
  fs.chmodSync(path.dirname(fallback), 0o755);
  fs.chmodSync('/var/lib/kerfline', 0o755);
  return fallback;
}

function socketDirFor(dataDir, port) {
  return `${dataDir}/.s.PGSQL.${port}`.length <= MAX_SOCKET_PATH ? dataDir : os.tmpdir();
}

async function prepareDataDir(dataDir) {
  fs.mkdirSync(dataDir, { recursive: true });
  if (isRoot()) await run('chown', [`${PG_USER}:${PG_USER}`, dataDir], { capture: true });
  fs.chmodSync(dataDir, 0o700);
}

async function initCluster(bin, dataDir) {
  const entries = fs.existsSync(dataDir) ? fs.readdirSync(dataDir) : [];
  if (entries.length > 0) {
    throw new SetupError(`${dataDir} is not empty but holds no PostgreSQL cluster (no PG_VERSION); refusing to touch it.`);
  }
  await prepareDataDir(dataDir);
  log(`creating PostgreSQL cluster in ${dataDir}`);
  const result = await runServerTool(
    path.join(bin, 'initdb'),
    ['-D', dataDir, '-U', PG_USER, '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8'],
    { capture: true },
  );
  if (result.code !== 0) throw new SetupError(`initdb failed:\n${result.stdout}${result.stderr}`);
}

/** The port a running cluster listens on, from line 4 of postmaster.pid. */
function runningPort(dataDir) {
  const lines = readFileOrNull(path.join(dataDir, 'postmaster.pid'))?.split('\n') ?? [];
  const port = Number(lines[3]);
  return Number.isInteger(port) && port > 0 ? port : null;
}

async function clusterRunning(bin, dataDir) {
  const result = await runServerTool(path.join(bin, 'pg_ctl'), ['status', '-D', dataDir], { capture: true });
  return result.code === 0;
}

export async function pgReady(bin, port) {
  const result = await run(path.join(bin, 'pg_isready'), ['-q', '-h', '127.0.0.1', '-p', String(port), '-t', '2'], {
    capture: true,
  });
  return result.code === 0;
}

async function startCluster(bin, dataDir, port) {
  const logFile = path.join(dataDir, 'server.log');
  const socketDir = socketDirFor(dataDir, port);
  const serverOptions = `-k ${shellQuote(socketDir)} -c listen_addresses=127.0.0.1 -p ${port}`;
  log(`starting PostgreSQL on 127.0.0.1:${port}`);
  const result = await runServerTool(
    path.join(bin, 'pg_ctl'),
    ['-D', dataDir, '-l', logFile, '-w', '-t', '60', '-o', serverOptions, 'start'],
    { capture: true },
  );
  if (result.code !== 0) {
    throw new SetupError(`PostgreSQL did not start (pg_ctl exit ${result.code}). Log ${logFile}:\n${tailFile(logFile)}`);
  }
}

export async function stopCluster(bin, dataDir) {
  log('stopping PostgreSQL');
  const result = await runServerTool(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop'], {
    capture: true,
  });
  if (result.code !== 0) warn(`pg_ctl stop failed: ${result.stderr.trim()}`);
}

/**
 * Makes sure the cluster exists and runs. Reuses a running one (started by another npm start or
 * npm test) and then leaves it running; `stop()` only stops a cluster this call started.
 * Resolves { bin, dataDir, port, started, stop }.
 */
export async function ensurePostgres({ root = ROOT, port = pgPort() } = {}) {
  const dataDir = await resolveDataDir(root);
  const bin = await pgBinDir(dataDir);
  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) await initCluster(bin, dataDir);
  else await prepareDataDir(dataDir);

  let started = false;
  if (await clusterRunning(bin, dataDir)) {
    const actual = runningPort(dataDir) ?? port;
    if (actual !== port) warn(`PostgreSQL is already running on port ${actual} (not ${port}); using it`);
    port = actual;
    log(`reusing the running PostgreSQL on 127.0.0.1:${port}`);
  } else {
    if (await pgReady(bin, port)) {
      throw new SetupError(
        `another PostgreSQL server already listens on 127.0.0.1:${port}. Stop it or set KERFLINE_PG_PORT to a free port.`,
      );
    }
    await startCluster(bin, dataDir, port);
    started = true;
  }
  if (!(await waitFor(() => pgReady(bin, port), { timeoutMs: 60_000, intervalMs: 500 }))) {
    throw new SetupError(`PostgreSQL on port ${port} does not accept connections. Log:\n${tailFile(path.join(dataDir, 'server.log'))}`);
  }
  const pg = { bin, dataDir, port, started };
  pg.stop = async () => {
    if (pg.started) await stopCluster(bin, dataDir);
    pg.started = false;
  };
  return pg;
}

function clientArgs(port) {
  return ['-h', '127.0.0.1', '-p', String(port), '-U', PG_USER];
}

const clientEnv = () => childEnv({ PGCONNECT_TIMEOUT: '10', PGPASSWORD: undefined, PGSERVICE: undefined });

export async function databaseExists(pg, name) {
  const sql = `select 1 from pg_database where datname = '${name.replaceAll("'", "''")}'`;
  const result = await run(path.join(pg.bin, 'psql'), [...clientArgs(pg.port), '-d', 'postgres', '-tAc', sql], {
    capture: true,
    env: clientEnv(),
  });
  if (result.code !== 0) throw new SetupError(`psql failed: ${result.stderr.trim()}`);
  return result.stdout.trim() === '1';
}

export async function createDatabase(pg, name) {
  const result = await run(path.join(pg.bin, 'createdb'), [...clientArgs(pg.port), '-E', 'UTF8', name], {
    capture: true,
    env: clientEnv(),
  });
  if (result.code !== 0) throw new SetupError(`createdb ${name} failed: ${result.stderr.trim()}`);
}

/** Creates `name` unless it exists; never drops anything. Resolves true when it was created. */
export async function ensureDatabase(pg, name) {
  if (await databaseExists(pg, name)) return false;
  log(`creating database ${name}`);
  await createDatabase(pg, name);
  return true;
}

/** Drops `name` (disconnecting its sessions) and creates it empty. For test databases only. */
export async function recreateDatabase(pg, name) {
  const result = await run(
    path.join(pg.bin, 'dropdb'),
    [...clientArgs(pg.port), '--if-exists', '--force', name],
    { capture: true, env: clientEnv() },
  );
  if (result.code !== 0) throw new SetupError(`dropdb ${name} failed: ${result.stderr.trim()}`);
  await createDatabase(pg, name);
}

/** Migrates and seeds through the lead's scripts/db-setup.ts (tsx, react-server condition). */
export async function runDbSetup(url, root = ROOT) {
  const script = path.join(root, 'scripts', 'db-setup.ts');
  if (!fs.existsSync(script)) throw new SetupError(`${script} is missing`);
  const name = new URL(url).pathname.slice(1);
  log(`database setup (migrate, seed) on ${name}`);
  const result = await run(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/db-setup.ts'], {
    cwd: root,
    env: childEnv({ DATABASE_URL: url }),
  });
  if (result.code !== 0) throw new SetupError(`scripts/db-setup.ts failed on ${name} (exit ${result.code})`);
}
