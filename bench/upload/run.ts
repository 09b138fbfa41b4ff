// Upload benchmark (issue: clip uploads). Needs the built app (`npm start` builds it) and its database:
//   node --require ./bench/lib/allow-server-modules.cjs --import tsx bench/upload/run.ts [--mib 1024]
// Pushes one file through tus-js-client (64 MiB chunks, as the browser sends) into the app over loopback, then the same bytes
// (a) copied on the same disk and (b) sent in one HTTP PUT to a bare Node server writing to the same disk.
// Prints each throughput, tus/(a), tus/(b), and the app's peak RSS growth during the tus upload.
// The S3 and two-process numbers come from bench/upload/s3.ts.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { benchChannel, makeSource, mibps, peakRssGrowth, startApp, tusUpload } from './lib';

const PORT = process.env.KERFLINE_PG_PORT ?? '54329';
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PORT}/kerfline`;
process.env.NEXTAUTH_SECRET ??= fs.readFileSync('.data/session-secret', 'utf8').trim();
const argMib = process.argv.indexOf('--mib');
const MIB = argMib > 0 ? Number(process.argv[argMib + 1]) : 1024;
const SIZE = MIB * 1024 * 1024;
const APP_PORT = Number(process.env.BENCH_APP_PORT ?? 3198);
// Everything on one disk: the project's .data folder.
const WORK = path.resolve('.data/bench-upload');

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
  await makeSource(src, SIZE);
  const { cookie, metadata, remove } = await benchChannel();
  const app = await startApp(APP_PORT, { UPLOAD_DIR: path.join(WORK, 'uploads') });
  try {
    // Warm up the route (first compile of the handler, first database connections) before measuring.
    const warm = path.join(WORK, 'warm.bin');
    fs.writeFileSync(warm, randomBytes(1024 * 1024));
    await tusUpload(APP_PORT, warm, cookie, metadata);
    const t0 = performance.now();
    const { base, growth } = await peakRssGrowth(app.pid!, () => tusUpload(APP_PORT, src, cookie, metadata));
    const tusMs = performance.now() - t0;

    const t1 = performance.now();
    await pipeline(fs.createReadStream(src), fs.createWriteStream(path.join(WORK, 'copy.bin')));
    const copyMs = performance.now() - t1;
    const putMs = await bareHttpPut(src, path.join(WORK, 'put.bin'));

    const tus = mibps(SIZE, tusMs);
    const copy = mibps(SIZE, copyMs);
    const put = mibps(SIZE, putMs);
    console.log(`${MIB} MiB, one disk, loopback:`);
    console.log(`  tus (tus-js-client, browser chunks, into the app, SHA-256 at finish): ${tus.toFixed(0)} MiB/s (${(tusMs / 1000).toFixed(2)} s)`);
    console.log(`  (a) plain file copy (stream):                                ${copy.toFixed(0)} MiB/s (${(copyMs / 1000).toFixed(2)} s)`);
    console.log(`  (b) one HTTP PUT to a bare Node server:                      ${put.toFixed(0)} MiB/s (${(putMs / 1000).toFixed(2)} s)`);
    console.log(`  tus/(a) ${(tus / copy).toFixed(2)}   tus/(b) ${(tus / put).toFixed(2)}   (goal tus/(b) >= 0.80)`);
    console.log(`  app RSS: ${(base / 1048576).toFixed(0)} MiB before, peak growth ${(growth / 1048576).toFixed(1)} MiB during the upload (goal <= 64 MiB)`);
  } finally {
    app.kill('SIGTERM');
    await remove();
    fs.rmSync(WORK, { recursive: true, force: true });
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
