import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');

// Every app a test file started and has not killed yet. If the test process ends without its afterAll
// (a crash, a hook that timed out), these are killed on the way out rather than left holding their ports.
const running = new Set<ChildProcess>();
process.once('exit', () => {
  for (const child of running) child.kill('SIGKILL');
});

const ended = (child: ChildProcess) => child.exitCode !== null || child.signalCode !== null;

/** The built app (`next start`), for tests that must go through real HTTP: tus uploads and restarts. */
export class AppServer {
  private child: ChildProcess | null = null;
  private log = '';

  /**
   * `startTimeoutMs`: `next start` answers within a few seconds on an idle machine, but on two cores shared
   * with builds and benchmarks it has taken most of a minute, so the default leaves room.
   */
  constructor(
    readonly port: number,
    private readonly env: Record<string, string>,
    private readonly startTimeoutMs = 90_000,
  ) {}

  get url(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    if (!fs.existsSync(path.join(ROOT, '.next', 'BUILD_ID'))) {
      throw new Error('These tests run against the built app: `npm test` builds it first (or run `npx next build`).');
    }
    const child = spawn(process.execPath, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'start', '-p', String(this.port), '-H', '127.0.0.1'], {
      cwd: ROOT,
      env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1', KERFLINE_MAIL_WORKER: 'off', ...this.env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    this.child = child;
    running.add(child);
    child.once('exit', () => running.delete(child));
    const append = (b: Buffer) => {
      this.log = (this.log + b.toString()).slice(-4000);
    };
    child.stdout?.on('data', append);
    child.stderr?.on('data', append);
    const deadline = Date.now() + this.startTimeoutMs;
    for (;;) {
      if (ended(child)) throw new Error(`app exited (${child.exitCode ?? child.signalCode}):\n${this.log}`);
      // Each probe is bounded too: a server that accepts but never answers must not outlast the deadline.
      const up = await fetch(`${this.url}/sign-in`, { signal: AbortSignal.timeout(5_000) }).then((r) => r.ok).catch(() => false);
      if (up) return;
      if (Date.now() > deadline) {
        // A half-started server would keep the port; it goes before the error does.
        await this.kill();
        throw new Error(`app did not start within ${this.startTimeoutMs / 1000} s:\n${this.log}`);
      }
      // Polling the port: `next start` gives no signal of its own when it is ready.
      await new Promise((r) => setTimeout(r, 250));
    }
  }

  /** SIGKILL: the process dies mid-request, as a crash or power cut would. */
  async kill(): Promise<void> {
    const child = this.child;
    this.child = null;
    // Checking signalCode too: a process already ended by a signal emits no second 'exit' to wait for.
    if (!child || ended(child)) return;
    await new Promise<void>((resolve) => {
      child.once('exit', () => resolve());
      child.kill('SIGKILL');
    });
  }

  /** True once the process has ended by itself or been killed. */
  exited(): boolean {
    return !this.child || this.child.exitCode !== null || this.child.signalCode !== null;
  }

  output(): string {
    return this.log;
  }
}
