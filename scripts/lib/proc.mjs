// Child-process helpers shared by start.mjs and test.mjs (Node built-ins only).
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

export const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

export function log(message) {
  process.stdout.write(`kerfline> ${message}\n`);
}

export function warn(message) {
  process.stderr.write(`kerfline> WARNING: ${message}\n`);
}

export class SetupError extends Error {}

/** The environment every child gets: the parent's, telemetry off, plus `extra` (undefined deletes). */
export function childEnv(extra = {}) {
  const env = { ...process.env, NEXT_TELEMETRY_DISABLED: '1' };
  for (const [key, value] of Object.entries(extra)) {
    if (value === undefined) delete env[key];
    else env[key] = String(value);
  }
  return env;
}

// Foreground children still running, so a SIGTERM to us can pass on to them.
const foreground = new Set();

export function killForeground(signal = 'SIGTERM') {
  for (const child of foreground) {
    try {
      child.kill(signal);
    } catch {
      // already gone
    }
  }
}

/**
 * Runs a command to completion. stdio is inherited unless `capture` (collect output silently)
 * or `tee` (show it and collect it). Resolves { code, stdout, stderr }; never rejects.
 */
export function run(cmd, args = [], { env = childEnv(), cwd = ROOT, capture = false, tee = false, input } = {}) {
  return new Promise((resolve) => {
    const piped = capture || tee;
    const stdin = input === undefined ? 'ignore' : 'pipe';
    const child = spawn(cmd, args, { cwd, env, stdio: piped ? [stdin, 'pipe', 'pipe'] : [stdin, 'inherit', 'inherit'] });
    foreground.add(child);
    let stdout = '';
    let stderr = '';
    if (piped) {
      child.stdout.on('data', (chunk) => {
        stdout += chunk;
        if (tee) process.stdout.write(chunk);
      });
      child.stderr.on('data', (chunk) => {
        stderr += chunk;
        if (tee) process.stderr.write(chunk);
      });
    }
    if (input !== undefined) child.stdin.end(input);
    child.on('error', (error) => {
      foreground.delete(child);
      resolve({ code: 127, stdout, stderr: `${stderr}${error.message}\n`, error });
    });
    // 'close' waits for the pipes; daemons started by pg_ctl keep no handle on them.
    child.on('close', (code, signal) => {
      foreground.delete(child);
      resolve({ code: code ?? (signal ? 128 : 1), signal, stdout, stderr });
    });
  });
}

/** Like run() with captured output; resolves the trimmed stdout, or null on failure. */
export async function output(cmd, args = [], options = {}) {
  const result = await run(cmd, args, { ...options, capture: true });
  return result.code === 0 ? result.stdout.trim() : null;
}

/**
 * Starts a long-running child in its own process group, so Ctrl-C in the terminal reaches only us
 * and we can stop children in order, and so killing the group also ends any workers it forked.
 * `logFile` sends its output to a file instead of our terminal.
 */
export function startService(name, cmd, args, { env = childEnv(), cwd = ROOT, logFile } = {}) {
  let stdio = ['ignore', 'inherit', 'inherit'];
  if (logFile) {
    const fd = fs.openSync(logFile, 'a');
    stdio = ['ignore', fd, fd];
  }
  const child = spawn(cmd, args, { cwd, env, stdio, detached: true });
  if (logFile) fs.closeSync(stdio[1]);
  const service = { name, child, exited: false, code: null, signal: null };
  service.exit = new Promise((resolve) => {
    child.on('error', (error) => {
      service.exited = true;
      service.code = 127;
      service.error = error;
      resolve(service);
    });
    child.on('exit', (code, signal) => {
      service.exited = true;
      service.code = code;
      service.signal = signal;
      resolve(service);
    });
  });
  liveServices.add(service);
  service.exit.then(() => liveServices.delete(service));
  return service;
}

const liveServices = new Set();

function signalGroup(pid, signal) {
  try {
    process.kill(-pid, signal);
    return true;
  } catch {
    return false;
  }
}

/** SIGTERM to the service's process group, SIGKILL after `graceMs`. */
export async function stopService(service, graceMs = 10_000) {
  if (!service?.child.pid) return;
  signalGroup(service.child.pid, 'SIGTERM');
  const timedOut = await Promise.race([service.exit.then(() => false), sleep(graceMs).then(() => true)]);
  // Stragglers in the group (forked workers) go too, even when the leader left in time.
  signalGroup(service.child.pid, 'SIGKILL');
  if (timedOut) await service.exit;
}

// Last resort when we exit without a clean shutdown (uncaught error): no orphaned servers.
process.on('exit', () => {
  for (const service of liveServices) signalGroup(service.child.pid, 'SIGKILL');
  killForeground('SIGKILL');
});

/** Polls `check` (async, truthy = done) every `intervalMs` until `timeoutMs`; resolves the value or null. */
export async function waitFor(check, { timeoutMs = 30_000, intervalMs = 300, abort } = {}) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (abort?.() || Date.now() > deadline) return null;
    await sleep(intervalMs);
  }
}

/** Any HTTP answer at all (status, redirect or error page) means the server is up. */
export async function httpAnswers(url, timeoutMs = 3000) {
  try {
    const response = await fetch(url, { redirect: 'manual', signal: AbortSignal.timeout(timeoutMs) });
    await response.arrayBuffer().catch(() => {});
    return response;
  } catch {
    return null;
  }
}

export function tailFile(file, lines = 30) {
  try {
    return fs.readFileSync(file, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '(no log)';
  }
}

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;
