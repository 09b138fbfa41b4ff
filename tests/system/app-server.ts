import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');

/** The built app (`next start`), for tests that must go through real HTTP: tus uploads and restarts. */
export class AppServer {
  private child: ChildProcess | null = null;
  private log = '';

  constructor(
    readonly port: number,
    private readonly env: Record<string, string>,
  ) {}

  get url(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    if (!fs.existsSync(path.join(ROOT, '.next', 'BUILD_ID'))) {
      throw new Error('These tests run against the built app: `npm test` builds it first (or run `npx next build`).');
    }
    this.child = spawn(process.execPath, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'start', '-p', String(this.port), '-H', '127.0.0.1'], {
      cwd: ROOT,
      env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1', KERFLINE_MAIL_WORKER: 'off', ...this.env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const append = (b: Buffer) => {
      this.log = (this.log + b.toString()).slice(-4000);
    };
    this.child.stdout?.on('data', append);
    this.child.stderr?.on('data', append);
    const deadline = Date.now() + 60_000;
    for (;;) {
      if (this.child.exitCode !== null) throw new Error(`app exited (${this.child.exitCode}):\n${this.log}`);
      const up = await fetch(`${this.url}/sign-in`).then((r) => r.ok).catch(() => false);
      if (up) return;
      if (Date.now() > deadline) throw new Error(`app did not start:\n${this.log}`);
      await new Promise((r) => setTimeout(r, 250));
    }
  }

  /** SIGKILL: the process dies mid-request, as a crash or power cut would. */
  async kill(): Promise<void> {
    const child = this.child;
    if (!child || child.exitCode !== null) return;
    await new Promise<void>((resolve) => {
      child.once('exit', () => resolve());
      child.kill('SIGKILL');
    });
    this.child = null;
  }

  /** True once the process has ended by itself or been killed. */
  exited(): boolean {
    return !this.child || this.child.exitCode !== null || this.child.signalCode !== null;
  }

  output(): string {
    return this.log;
  }
}
