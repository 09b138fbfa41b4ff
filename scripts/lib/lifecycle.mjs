// Ordered teardown: whatever was started registers how to stop it; signals run the stops once.
import { killForeground, log, warn } from './proc.mjs';

const cleanups = [];
let shuttingDown = null;

/** True once teardown began: failures after that are consequences, not news. */
export const isShuttingDown = () => shuttingDown !== null;

/** Registers `fn` (async) to run at teardown; later registrations run first. */
export function addCleanup(name, fn) {
  cleanups.push({ name, fn });
}

/** Runs every cleanup once (LIFO). Safe to call repeatedly; later calls await the first. */
export function teardown() {
  shuttingDown ??= (async () => {
    while (cleanups.length) {
      const { name, fn } = cleanups.pop();
      try {
        await fn();
      } catch (error) {
        warn(`stopping ${name} failed: ${error.message}`);
      }
    }
  })();
  return shuttingDown;
}

/** SIGINT/SIGTERM/SIGHUP: stop what we started, then exit with `exitCode`. A second signal forces it. */
export function handleSignals({ exitCode = 130, onSignal } = {}) {
  let received = false;
  const handler = async (signal) => {
    if (received) {
      warn(`second ${signal}: exiting without waiting`);
      process.exit(exitCode);
    }
    received = true;
    log(`${signal} received, shutting down...`);
    onSignal?.(signal);
    // Children in our own group got Ctrl-C already; a SIGTERM sent to us alone did not reach them.
    killForeground('SIGTERM');
    await teardown();
    process.exit(exitCode);
  };
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, handler);
}
