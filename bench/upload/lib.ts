// Shared by the upload benchmarks (run.ts: disk; s3.ts: S3 and two processes).
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import { encode } from 'next-auth/jwt';
import { Upload } from 'tus-js-client';
import { UPLOAD_CHUNK_BYTES } from '@/lib/clips/upload-chunk';

export const mibps = (bytes: number, ms: number) => bytes / 1024 / 1024 / (ms / 1000);

/** RSS of a process and all its descendants, from /proc (Linux). */
export function treeRss(pid: number): number {
  let total = 0;
  const visit = (p: number) => {
    try {
      const status = fs.readFileSync(`/proc/${p}/status`, 'utf8');
      total += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) * 1024;
      for (const task of fs.readdirSync(`/proc/${p}/task`)) {
        const kids = fs.readFileSync(`/proc/${p}/task/${task}/children`, 'utf8').trim();
        for (const k of kids ? kids.split(/\s+/) : []) visit(Number(k));
      }
    } catch {
      /* the process ended between reads */
    }
  };
  visit(pid);
  return total;
}

/** Peak RSS growth of a process tree while `work` runs, sampled every 50 ms. */
export async function peakRssGrowth<T>(pid: number, work: () => Promise<T>): Promise<{ result: T; base: number; growth: number }> {
  const base = treeRss(pid);
  let peak = base;
  const sampler = setInterval(() => {
    peak = Math.max(peak, treeRss(pid));
  }, 50);
  try {
    const result = await work();
    return { result, base, growth: peak - base };
  } finally {
    clearInterval(sampler);
  }
}

export async function makeSource(file: string, size: number) {
  const out = fs.createWriteStream(file);
  const piece = randomBytes(8 * 1024 * 1024);
  for (let left = size; left > 0; left -= piece.length) {
    if (!out.write(left >= piece.length ? piece : piece.subarray(0, left))) await new Promise<void>((r) => out.once('drain', () => r()));
  }
  await new Promise<void>((r) => out.end(() => r()));
}

/** `next start` on `port` with `env` on top of ours; background workers off so only the upload runs. */
export async function startApp(port: number, env: Record<string, string>): Promise<ChildProcess> {
  // BENCH_APP_NODE_ARGS: node flags for the app alone, e.g. `--cpu-prof --cpu-prof-dir=DIR` (not allowed in NODE_OPTIONS).
  const nodeArgs = process.env.BENCH_APP_NODE_ARGS?.split(' ').filter(Boolean) ?? [];
  const child = spawn(process.execPath, [...nodeArgs, 'node_modules/next/dist/bin/next', 'start', '-p', String(port), '-H', '127.0.0.1'], {
    env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1', KERFLINE_MAIL_WORKER: 'off', KERFLINE_CLIP_WORKER: 'off', NEXTAUTH_URL: `http://127.0.0.1:${port}`, ...env },
    // BENCH_APP_LOG: the app's output goes to that file (with DEBUG=tus-node-server:* the S3 store's part timestamps).
    stdio: process.env.BENCH_APP_LOG ? ['ignore', fs.openSync(process.env.BENCH_APP_LOG, 'a'), fs.openSync(process.env.BENCH_APP_LOG, 'a')] : 'ignore',
  });
  for (let i = 0; i < 240; i++) {
    if (await fetch(`http://127.0.0.1:${port}/sign-in`).then((r) => r.ok).catch(() => false)) return child;
    await new Promise((r) => setTimeout(r, 250));
  }
  child.kill('SIGKILL');
  throw new Error('the app did not start; run `npm start` once so the build exists');
}

/** tus-js-client as the browser runs it: UPLOAD_CHUNK_BYTES per PATCH (BENCH_CHUNK_MIB overrides), one PATCH at a time. */
export function tusUpload(port: number, file: string, cookie: string, metadata: Record<string, string>): Promise<void> {
  return new Promise((resolve, reject) => {
    const upload = new Upload(fs.createReadStream(file), {
      endpoint: `http://127.0.0.1:${port}/api/uploads`,
      chunkSize: process.env.BENCH_CHUNK_MIB ? Number(process.env.BENCH_CHUNK_MIB) * 1024 * 1024 : UPLOAD_CHUNK_BYTES,
      uploadSize: fs.statSync(file).size,
      // The app refuses state-changing requests without its own Origin (issue 12), as a browser sends it.
      headers: { cookie, origin: `http://127.0.0.1:${port}` },
      metadata,
      retryDelays: [],
      onError: reject,
      onSuccess: () => resolve(),
      // BENCH_TRACE: one line per PATCH (start and end, ms since the epoch) appended to that file, to set beside the app's log.
      ...(process.env.BENCH_TRACE ? patchTrace(process.env.BENCH_TRACE) : {}),
    });
    upload.start();
  });
}

function patchTrace(file: string) {
  const started = new Map<unknown, number>();
  return {
    onBeforeRequest: (req: { getMethod(): string }) => void started.set(req, Date.now()),
    onAfterResponse: (req: { getMethod(): string; getHeader(h: string): string | undefined }, res: { getStatus(): number; getHeader(h: string): string | undefined }) => {
      const t0 = started.get(req);
      started.delete(req);
      fs.appendFileSync(file, `${req.getMethod()} ${t0 ?? 0} ${Date.now()} ${res.getStatus()} offset ${res.getHeader('Upload-Offset') ?? ''}\n`);
    },
  };
}

/** A throwaway user, channel, episode and segment, a session cookie for them, and how to remove it all. */
export async function benchChannel() {
  const { db } = await import('@/db/client');
  const { createChannel } = await import('@/lib/channels/queries');
  const { createEpisode } = await import('@/lib/episodes/queries');
  const [user] = await db('users')
    .insert({ email: `bench-${randomUUID()}@bench.kerfline.test`, name: 'Bench shop hand', password_hash: 'x' })
    .returning<{ id: string }[]>(['id']);
  if (!user) throw new Error('no user');
  const channel = await createChannel('Upload bench', user.id);
  const episode = await createEpisode(channel.id, { title: 'Upload bench', premise: '', stage: 'shoot', targetSeconds: null, shootDate: null, publishDate: null });
  const [segment] = await db('segments').insert({ episode_id: episode.id, position: 'a0', kind: 'build', level: 1, title: 'Bench' }).returning<{ id: string }[]>(['id']);
  const cookie = `next-auth.session-token=${await encode({ token: { sub: user.id }, secret: process.env.NEXTAUTH_SECRET ?? '' })}`;
  const metadata = { segmentId: segment!.id, filename: 'bench.bin', filetype: 'video/mp4' };
  const remove = async () => {
    await db('channels').where({ id: channel.id }).delete();
    await db('users').where({ id: user.id }).delete();
    await db.destroy();
  };
  return { cookie, metadata, remove };
}

const FIELDS = ['rss', 'heapTotal', 'heapUsed', 'external', 'arrayBuffers'] as const;

/**
 * What the app's memory grew by between `from` and `to` (ms since the epoch), from memory-probe.cjs's samples:
 * per field of process.memoryUsage(), the peak in that window less the last sample before it.
 */
export function memoryGrowth(file: string, from: number, to: number): Record<(typeof FIELDS)[number], number> | null {
  const rows = fs
    .readFileSync(file, 'utf8')
    .split('\n')
    .filter(Boolean)
    .map((line) => line.split(' ').map(Number));
  const before = rows.filter((r) => (r[0] ?? 0) < from).at(-1);
  const during = rows.filter((r) => (r[0] ?? 0) >= from && (r[0] ?? 0) <= to);
  if (!before || during.length === 0) return null;
  const out = {} as Record<(typeof FIELDS)[number], number>;
  FIELDS.forEach((field, i) => {
    out[field] = Math.max(...during.map((r) => r[i + 1] ?? 0)) - (before[i + 1] ?? 0);
  });
  return out;
}
