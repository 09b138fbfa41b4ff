// Upload benchmark (issue: clip uploads). Needs the built app (`npm start` builds it) and its database:
//   node --require ./bench/lib/allow-server-modules.cjs --import tsx bench/upload/run.ts [--mib 1024]
// Pushes one file through tus-js-client (8 MiB chunks) into the app over loopback, then the same bytes
// (a) copied on the same disk and (b) sent in one HTTP PUT to a bare Node server writing to the same disk.
// Prints each throughput, tus/(a), tus/(b), and the app's peak RSS growth during the tus upload.
import { spawn } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { encode } from 'next-auth/jwt';
import { Upload } from 'tus-js-client';

const PORT = process.env.KERFLINE_PG_PORT ?? '54329';
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PORT}/kerfline`;
process.env.NEXTAUTH_SECRET ??= fs.readFileSync('.data/session-secret', 'utf8').trim();
const argMib = process.argv.indexOf('--mib');
const MIB = argMib > 0 ? Number(process.argv[argMib + 1]) : 1024;
const SIZE = MIB * 1024 * 1024;
const APP_PORT = Number(process.env.BENCH_APP_PORT ?? 3198);
// Everything on one disk: the project's .data folder.
const WORK = path.resolve('.data/bench-upload');

const mibps = (bytes: number, ms: number) => bytes / 1024 / 1024 / (ms / 1000);

/** RSS of a process and all its descendants, from /proc (Linux). */
function treeRss(pid: number): number {
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

async function makeSource(file: string) {
  const out = fs.createWriteStream(file);
  const piece = randomBytes(8 * 1024 * 1024);
  for (let left = SIZE; left > 0; left -= piece.length) {
    if (!out.write(left >= piece.length ? piece : piece.subarray(0, left))) await new Promise<void>((r) => out.once('drain', () => r()));
  }
  await new Promise<void>((r) => out.end(() => r()));
}

async function startApp(uploadDir: string) {
  const child = spawn(process.execPath, ['node_modules/next/dist/bin/next', 'start', '-p', String(APP_PORT), '-H', '127.0.0.1'], {
    env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1', UPLOAD_DIR: uploadDir, KERFLINE_MAIL_WORKER: 'off', KERFLINE_CLIP_WORKER: 'off', NEXTAUTH_URL: `http://127.0.0.1:${APP_PORT}` },
    stdio: 'ignore',
  });
  for (let i = 0; i < 240; i++) {
    if (await fetch(`http://127.0.0.1:${APP_PORT}/sign-in`).then((r) => r.ok).catch(() => false)) return child;
    await new Promise((r) => setTimeout(r, 250));
  }
  child.kill('SIGKILL');
  throw new Error('the app did not start; run `npm start` once so the build exists');
}

function tusUpload(file: string, cookie: string, metadata: Record<string, string>): Promise<void> {
  return new Promise((resolve, reject) => {
    const upload = new Upload(fs.createReadStream(file), {
      endpoint: `http://127.0.0.1:${APP_PORT}/api/uploads`,
      chunkSize: 8 * 1024 * 1024,
      uploadSize: fs.statSync(file).size,
      headers: { cookie },
      metadata,
      retryDelays: [],
      onError: reject,
      onSuccess: () => resolve(),
    });
    upload.start();
  });
}

async function bareHttpPut(src: string, dest: string): Promise<number> {
  const server = http.createServer((req, res) => {
    pipeline(req, fs.createWriteStream(dest)).then(
      () => res.writeHead(204).end(),
      () => res.writeHead(500).end(),
    );
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const { port } = server.address() as { port: number };
  const t = performance.now();
  await new Promise<void>((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, method: 'PUT', path: '/', headers: { 'content-length': SIZE } }, (res) => {
      res.resume();
      res.on('end', () => resolve());
    });
    req.on('error', reject);
    pipeline(fs.createReadStream(src), req).catch(reject);
  });
  const ms = performance.now() - t;
  server.close();
  return ms;
}

async function main() {
  fs.rmSync(WORK, { recursive: true, force: true });
  fs.mkdirSync(WORK, { recursive: true });
  const src = path.join(WORK, 'source.bin');
  console.log(`Writing a ${MIB} MiB source file in ${WORK} …`);
  await makeSource(src);

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

  const app = await startApp(path.join(WORK, 'uploads'));
  try {
    // Warm up the route (first compile of the handler, first database connections) before measuring.
    const warm = path.join(WORK, 'warm.bin');
    fs.writeFileSync(warm, randomBytes(1024 * 1024));
    await tusUpload(warm, cookie, metadata);
    const base = treeRss(app.pid!);
    let peak = base;
    const sampler = setInterval(() => {
      peak = Math.max(peak, treeRss(app.pid!));
    }, 50);
    const t0 = performance.now();
    await tusUpload(src, cookie, metadata);
    const tusMs = performance.now() - t0;
    clearInterval(sampler);

    const t1 = performance.now();
    await pipeline(fs.createReadStream(src), fs.createWriteStream(path.join(WORK, 'copy.bin')));
    const copyMs = performance.now() - t1;
    const putMs = await bareHttpPut(src, path.join(WORK, 'put.bin'));

    const tus = mibps(SIZE, tusMs);
    const copy = mibps(SIZE, copyMs);
    const put = mibps(SIZE, putMs);
    console.log(`${MIB} MiB, one disk, loopback:`);
    console.log(`  tus (tus-js-client, 8 MiB chunks, into the app, SHA-256 at finish): ${tus.toFixed(0)} MiB/s (${(tusMs / 1000).toFixed(2)} s)`);
    console.log(`  (a) plain file copy (stream):                                ${copy.toFixed(0)} MiB/s (${(copyMs / 1000).toFixed(2)} s)`);
    console.log(`  (b) one HTTP PUT to a bare Node server:                      ${put.toFixed(0)} MiB/s (${(putMs / 1000).toFixed(2)} s)`);
    console.log(`  tus/(a) ${(tus / copy).toFixed(2)}   tus/(b) ${(tus / put).toFixed(2)}   (goal tus/(b) >= 0.80)`);
    console.log(`  app RSS: ${(base / 1048576).toFixed(0)} MiB before, peak growth ${((peak - base) / 1048576).toFixed(1)} MiB during the upload (goal <= 64 MiB)`);
  } finally {
    app.kill('SIGTERM');
    await db('channels').where({ id: channel.id }).delete();
    await db('users').where({ id: user.id }).delete();
    await db.destroy();
    fs.rmSync(WORK, { recursive: true, force: true });
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
