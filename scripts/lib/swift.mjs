// A project-local OpenStack Swift with its s3api middleware: the S3-compatible server `npm test` runs
// the S3 clip store against. Debian's swift packages, one replica, one device folder, all on loopback.
// Configuration follows ../shared/STACK-NOTES.md ("S3-compatible storage on loopback").
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ROOT, SetupError, httpAnswers, log, run, startService, stopService, tailFile, waitFor } from './proc.mjs';

// The proxy (S3 endpoint) listens on KERFLINE_SWIFT_PORT; object, container, account and memcached on the next four.
export const swiftPort = () => Number(process.env.KERFLINE_SWIFT_PORT || 16000);

const ACCOUNT = 'kerfline';
const USER = 'clips';
export const SWIFT_BUCKET = 'kerfline-test-clips';

const SERVERS = [
  { name: 'object', offset: 1, egg: 'object' },
  { name: 'container', offset: 2, egg: 'container' },
  { name: 'account', offset: 3, egg: 'account' },
];

const currentUser = () => os.userInfo().username;

function serverConf(dir, { name, egg }, port) {
  return `[DEFAULT]
bind_ip = 127.0.0.1
bind_port = ${port}
workers = 0
user = ${currentUser()}
swift_dir = ${dir}/conf
devices = ${dir}/devices
mount_check = false
log_level = WARNING

[pipeline:main]
pipeline = ${name}-server

[app:${name}-server]
use = egg:swift#${egg}
`;
}

function proxyConf(dir, port, secret) {
  return `[DEFAULT]
bind_ip = 127.0.0.1
bind_port = ${port}
workers = 0
user = ${currentUser()}
swift_dir = ${dir}/conf
log_level = WARNING

[pipeline:main]
pipeline = catch_errors gatekeeper healthcheck proxy-logging cache listing_formats bulk s3api tempauth copy slo dlo proxy-logging proxy-server

[app:proxy-server]
use = egg:swift#proxy
account_autocreate = true

[filter:tempauth]
use = egg:swift#tempauth
user_${ACCOUNT}_${USER} = ${secret} .admin

[filter:s3api]
use = egg:swift#s3api
location = us-east-1

[filter:cache]
use = egg:swift#memcache
memcache_servers = 127.0.0.1:${port + 4}

[filter:catch_errors]
use = egg:swift#catch_errors

[filter:gatekeeper]
use = egg:swift#gatekeeper

[filter:healthcheck]
use = egg:swift#healthcheck

[filter:proxy-logging]
use = egg:swift#proxy_logging

[filter:listing_formats]
use = egg:swift#listing_formats

[filter:bulk]
use = egg:swift#bulk

[filter:copy]
use = egg:swift#copy

[filter:slo]
use = egg:swift#slo

[filter:dlo]
use = egg:swift#dlo
`;
}

/** Config, rings and the device folder, made once per data folder; ports are rewritten every start. */
async function prepare(dir, port) {
  const conf = path.join(dir, 'conf');
  fs.mkdirSync(conf, { recursive: true });
  fs.mkdirSync(path.join(dir, 'devices', 'd1'), { recursive: true });
  const secretFile = path.join(dir, 'secret');
  if (!fs.existsSync(secretFile)) fs.writeFileSync(secretFile, crypto.randomBytes(18).toString('hex'), { mode: 0o600 });
  const secret = fs.readFileSync(secretFile, 'utf8').trim();
  const swiftConf = path.join(conf, 'swift.conf');
  if (!fs.existsSync(swiftConf)) {
    const suffix = crypto.randomBytes(8).toString('hex');
    fs.writeFileSync(swiftConf, `[swift-hash]\nswift_hash_path_suffix = ${suffix}\nswift_hash_path_prefix = kerfline\n\n[storage-policy:0]\nname = Policy-0\ndefault = yes\n`);
  }
  // Rings name each server's port, so they are rebuilt when the port changed since the last run.
  const portFile = path.join(conf, 'ring-port');
  const builtFor = fs.existsSync(portFile) ? fs.readFileSync(portFile, 'utf8').trim() : '';
  if (builtFor !== String(port)) {
    for (const { name, offset } of SERVERS) {
      const builder = path.join(conf, `${name}.builder`);
      fs.rmSync(builder, { force: true });
      fs.rmSync(path.join(conf, `${name}.ring.gz`), { force: true });
      // Source: STACK-NOTES (part power 6, one replica, min_part_hours 1; one device at weight 100).
      for (const args of [['create', '6', '1', '1'], ['add', `r1z1-127.0.0.1:${port + offset}/d1`, '100'], ['rebalance']]) {
        const result = await run('swift-ring-builder', [builder, ...args], { capture: true, cwd: conf });
        // rebalance exits 1 with a warning when nothing moved; the ring file is what matters.
        if (result.code > 1) throw new SetupError(`swift-ring-builder ${name} ${args[0]} failed:\n${result.stdout}${result.stderr}`);
      }
      if (!fs.existsSync(path.join(conf, `${name}.ring.gz`))) throw new SetupError(`swift-ring-builder made no ${name} ring`);
    }
    fs.writeFileSync(portFile, String(port));
  }
  for (const server of SERVERS) fs.writeFileSync(path.join(conf, `${server.name}-server.conf`), serverConf(dir, server, port + server.offset));
  fs.writeFileSync(path.join(conf, 'proxy-server.conf'), proxyConf(dir, port, secret));
  return { conf, secret };
}

/** A Swift-native call through tempauth (no SDK needed): the token and the account's storage URL. */
async function swiftToken(port, secret) {
  const res = await fetch(`http://127.0.0.1:${port}/auth/v1.0`, {
    headers: { 'X-Storage-User': `${ACCOUNT}:${USER}`, 'X-Storage-Pass': secret },
    signal: AbortSignal.timeout(10_000),
  });
  if (res.status !== 200) throw new SetupError(`Swift tempauth answered ${res.status}`);
  return { token: res.headers.get('x-auth-token'), storageUrl: res.headers.get('x-storage-url') };
}

/** Creates the bucket (a Swift container) unless it exists. */
async function ensureBucket(port, secret, bucket) {
  const { token, storageUrl } = await swiftToken(port, secret);
  const res = await fetch(`${storageUrl}/${bucket}`, { method: 'PUT', headers: { 'X-Auth-Token': token }, signal: AbortSignal.timeout(10_000) });
  if (res.status !== 201 && res.status !== 202) throw new SetupError(`creating bucket ${bucket} answered ${res.status}`);
}

// The proxy's healthcheck, and any HTTP answer at all from the three storage servers behind it.
async function healthy(port) {
  if ((await httpAnswers(`http://127.0.0.1:${port}/healthcheck`, 2000))?.status !== 200) return false;
  for (const { offset } of SERVERS) if (!(await httpAnswers(`http://127.0.0.1:${port + offset}/`, 2000))) return false;
  return true;
}

/**
 * Starts memcached and the four Swift servers from `dir` (default .data/swift) and creates the test
 * bucket; `fresh` empties the stored objects first, as the test databases are recreated each run.
 * Resolves { endpoint, bucket, region, accessKeyId, secretAccessKey, env, stop }.
 */
export async function ensureSwift({ root = ROOT, dir = path.join(root, '.data', 'swift'), port = swiftPort(), bucket = SWIFT_BUCKET, fresh = false } = {}) {
  if (await httpAnswers(`http://127.0.0.1:${port}/`, 1000)) throw new SetupError(`port ${port} is already in use; set KERFLINE_SWIFT_PORT to a free port (it uses the next four too)`);
  if (fresh) fs.rmSync(path.join(dir, 'devices'), { recursive: true, force: true });
  const { conf, secret } = await prepare(dir, port);
  const logFile = path.join(dir, 'swift.log');
  const services = [];
  const stop = async () => {
    for (const service of services.reverse()) await stopService(service, 5000);
  };
  services.push(startService('memcached', 'memcached', ['-l', '127.0.0.1', '-p', String(port + 4), '-U', '0', '-m', '32', ...(process.getuid?.() === 0 ? ['-u', 'root'] : [])], { logFile }));
  for (const { name } of SERVERS) services.push(startService(`swift-${name}`, `swift-${name}-server`, [path.join(conf, `${name}-server.conf`), '--verbose'], { logFile }));
  services.push(startService('swift-proxy', 'swift-proxy-server', [path.join(conf, 'proxy-server.conf'), '--verbose'], { logFile }));
  log(`starting Swift (s3api) on 127.0.0.1:${port}`);
  const up = await waitFor(() => healthy(port), { timeoutMs: 90_000, intervalMs: 500, abort: () => services.some((s) => s.exited) });
  if (!up) {
    const gone = services.find((s) => s.exited);
    await stop();
    throw new SetupError(`Swift did not come up${gone ? ` (${gone.name} exited ${gone.code})` : ''}. Log ${logFile}:\n${tailFile(logFile)}`);
  }
  try {
    await ensureBucket(port, secret, bucket);
  } catch (error) {
    await stop();
    throw error;
  }
  const endpoint = `http://127.0.0.1:${port}`;
  const accessKeyId = `${ACCOUNT}:${USER}`;
  return {
    endpoint,
    bucket,
    region: 'us-east-1',
    accessKeyId,
    secretAccessKey: secret,
    // The variables the S3 clip store reads (storage/config.ts), for the test runners and the apps they start.
    env: { S3_ENDPOINT: endpoint, S3_BUCKET: bucket, S3_REGION: 'us-east-1', S3_ACCESS_KEY_ID: accessKeyId, S3_SECRET_ACCESS_KEY: secret },
    stop,
  };
}
