// Upload benchmark on S3 and with two app processes (issue: several machines). Needs the built app and
// the `npm start` database, like run.ts; run it under `nice` on a shared machine:
//   nice -n 10 node --require ./bench/lib/allow-server-modules.cjs --import tsx bench/upload/s3.ts [--mib 1024]
// The S3 server: S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY (and S3_REGION) when set; otherwise a
// Swift with s3api started here (scripts/lib/swift.mjs) under .data/bench-swift on KERFLINE_SWIFT_PORT.
// It makes its own bucket, and measures on one file of --mib MiB:
//   1. tus-js-client (64 MiB chunks, as the browser sends) into one app process with STORAGE=s3 (the time includes the clip's
//      SHA-256: hashed on the way in, or read back from S3 when the store has no verified digest; it says which), and that
//      app's peak RSS growth;
//   2. the same file as a plain multipart upload with the AWS SDK (@aws-sdk/lib-storage, 8 MiB parts)
//      to the same server, four parts at a time (the SDK default) and one at a time;
//   3. reading the SDK's copy back from S3 with its SHA-256 (what a finish without a verified digest adds);
//   4. two simultaneous tus uploads into one process, then one into each of two processes: aggregate MiB/s.
// --memory also loads memory-probe.cjs into the app and prints what each tus upload's RSS growth is made of
// (V8 heap, Buffers and other memory outside it, the rest: native allocations, code, stacks).
// --runs N repeats 1 and 2 N times, interleaved so a change in the machine's load hits both alike, and prints
// each run's ratios with the load average, then the median and the spread; --no-pairs skips 4.
import './bench-env';
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { CreateBucketCommand, DeleteBucketCommand, DeleteObjectsCommand, GetObjectCommand, ListObjectsV2Command, type S3Client } from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';
import { Upload as SdkUpload } from '@aws-sdk/lib-storage';
import type { S3Settings } from '@/storage/config';
import { sha256Of } from '@/storage/ingest';
import { makeS3Client } from '@/storage/s3-client';
import { S3ClipStore } from '@/storage/s3-store';
import { startTraceProxy } from './s3-trace-proxy';
import { benchChannel, makeSource, memoryGrowth, mibps, peakRssGrowth, startApp, tusUpload } from './lib';

const argMib = process.argv.indexOf('--mib');
const MIB = argMib > 0 ? Number(process.argv[argMib + 1]) : 1024;
const SIZE = MIB * 1024 * 1024;
const argRuns = process.argv.indexOf('--runs');
const RUNS = argRuns > 0 ? Math.max(1, Number(process.argv[argRuns + 1])) : 1;
const PAIRS = !process.argv.includes('--no-pairs');
const MEMORY = process.argv.includes('--memory');
const argTrace = process.argv.indexOf('--trace');
const TRACE = argTrace > 0 ? path.resolve(process.argv[argTrace + 1] ?? 'bench-trace') : null;
const PORT_A = Number(process.env.BENCH_APP_PORT ?? 3198);
const PORT_B = Number(process.env.BENCH_APP_PORT_B ?? PORT_A + 1);
const WORK = path.resolve('.data/bench-upload-s3');
const PART = 8 * 1024 * 1024;

type Swift = { env: Record<string, string>; stop: () => Promise<void> };

async function s3Server(): Promise<{ settings: S3Settings; stop: () => Promise<void> }> {
  const bucket = `kerfline-bench-${randomBytes(4).toString('hex')}`;
  const base = { bucket, forcePathStyle: true, partSize: PART, maxParts: 1000 };
  if (process.env.S3_ENDPOINT) {
    const { S3_ENDPOINT, S3_REGION, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY } = process.env;
    return { settings: { ...base, endpoint: S3_ENDPOINT, region: S3_REGION ?? 'us-east-1', accessKeyId: S3_ACCESS_KEY_ID, secretAccessKey: S3_SECRET_ACCESS_KEY }, stop: async () => {} };
  }
  const swiftModule = '../../scripts/lib/swift.mjs';
  const { ensureSwift } = (await import(swiftModule)) as { ensureSwift: (o: { dir: string; fresh: boolean }) => Promise<Swift> };
  const dir = path.resolve('.data/bench-swift');
  const swift = await ensureSwift({ dir, fresh: true });
  const e = swift.env;
  return {
    settings: { ...base, endpoint: e.S3_ENDPOINT, region: e.S3_REGION ?? 'us-east-1', accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    stop: async () => {
      await swift.stop();
      fs.rmSync(path.join(dir, 'devices'), { recursive: true, force: true });
    },
  };
}

async function emptyBucket(client: S3Client, bucket: string) {
  for (;;) {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket }));
    const keys = (page.Contents ?? []).map((o) => ({ Key: o.Key! }));
    if (keys.length === 0) break;
    await client.send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: keys, Quiet: true } }));
  }
  await client.send(new DeleteBucketCommand({ Bucket: bucket })).catch(() => {});
}

async function sdkMultipart(client: S3Client, bucket: string, src: string, queueSize: number): Promise<number> {
  const t = performance.now();
  await new SdkUpload({ client, params: { Bucket: bucket, Key: `sdk-${queueSize}.bin`, Body: fs.createReadStream(src) }, partSize: PART, queueSize }).done();
  return performance.now() - t;
}

const appEnv = (s: S3Settings): Record<string, string> => ({
  STORAGE: 's3',
  S3_ENDPOINT: s.endpoint ?? '',
  S3_BUCKET: s.bucket,
  S3_REGION: s.region,
  S3_ACCESS_KEY_ID: s.accessKeyId ?? '',
  S3_SECRET_ACCESS_KEY: s.secretAccessKey ?? '',
});

async function startTrace(dir: string, endpoint: string) {
  fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  process.env.BENCH_TRACE = path.join(dir, 'patches.log');
  process.env.BENCH_APP_LOG = path.join(dir, 'app.log');
  process.env.DEBUG = 'tus-node-server:*';
  console.log(`Tracing into ${dir}: S3 requests pass a logging proxy, so these numbers are not comparable to untraced runs.`);
  return startTraceProxy(endpoint, path.join(dir, 's3.log'));
}

async function main() {
  fs.rmSync(WORK, { recursive: true, force: true });
  fs.mkdirSync(WORK, { recursive: true });
  const src = path.join(WORK, 'source.bin');
  console.log(`Writing a ${MIB} MiB source file in ${WORK} …`);
  await makeSource(src, SIZE);
  const server = await s3Server();
  const { settings } = server;
  const client = makeS3Client(settings);
  await client.send(new CreateBucketCommand({ Bucket: settings.bucket }));
  const { cookie, metadata, remove } = await benchChannel();
  // --trace DIR: the app talks to S3 through a logging proxy; PATCH, S3 request and part timestamps go to DIR (trace-report.ts reads them).
  const proxy = TRACE ? await startTrace(TRACE, settings.endpoint ?? '') : null;
  const memoryFile = path.join(WORK, 'memory.log');
  if (MEMORY) {
    process.env.BENCH_MEMORY_FILE = memoryFile;
    process.env.BENCH_APP_NODE_ARGS = `${process.env.BENCH_APP_NODE_ARGS ?? ''} --require ${path.resolve('bench/upload/memory-probe.cjs')}`;
  }
  const apps = [await startApp(PORT_A, appEnv(proxy ? { ...settings, endpoint: proxy.endpoint } : settings))];
  // Stopped by hand (Ctrl-C, kill): the app processes and Swift go too, rather than hold their ports.
  const onSignal = () => {
    for (const app of apps) app.kill('SIGKILL');
    void server.stop().finally(() => process.exit(1));
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    const warm = path.join(WORK, 'warm.bin');
    fs.writeFileSync(warm, randomBytes(1024 * 1024));
    await tusUpload(PORT_A, warm, cookie, metadata);

    type Run = { tusMs: number; sdk4Ms: number; sdk1Ms: number; growth: number; load: number };
    const runs: Run[] = [];
    let base = 0;
    // Each upload starts once the one before is on disk: Swift's writes of the last 1 GiB otherwise flush
    // during whichever upload comes next, and that upload pays for them.
    const settle = () => execFileSync('sync');
    for (let i = 0; i < RUNS; i++) {
      settle();
      const load = os.loadavg()[0] ?? 0;
      const t0 = performance.now();
      const from = Date.now();
      const rss = await peakRssGrowth(apps[0]!.pid!, () => tusUpload(PORT_A, src, cookie, metadata));
      const tusMs = performance.now() - t0;
      const memory = MEMORY ? memoryGrowth(memoryFile, from, Date.now()) : null;
      if (memory) {
        const mib = (b: number) => (b / 1048576).toFixed(1);
        const rest = memory.rss - memory.heapTotal - memory.external;
        console.log(`  run ${i + 1} memory growth (peaks, MiB): rss ${mib(memory.rss)} = V8 heap ${mib(memory.heapTotal)} (used ${mib(memory.heapUsed)}) + outside the heap ${mib(memory.external)} (Buffers ${mib(memory.arrayBuffers)}) + the rest about ${mib(rest)}`);
      }
      base = rss.base;
      settle();
      const sdk4Ms = await sdkMultipart(client, settings.bucket, src, 4);
      settle();
      const sdk1Ms = await sdkMultipart(client, settings.bucket, src, 1);
      runs.push({ tusMs, sdk4Ms, sdk1Ms, growth: rss.growth, load });
      if (RUNS > 1) {
        const [tus, sdk4, sdk1] = [tusMs, sdk4Ms, sdk1Ms].map((ms) => mibps(SIZE, ms)) as [number, number, number];
        console.log(`  run ${i + 1}/${RUNS} (load ${load.toFixed(1)}): tus ${tus.toFixed(1)}, SDK(4) ${sdk4.toFixed(1)}, SDK(1) ${sdk1.toFixed(1)} MiB/s; tus/SDK(4) ${(tus / sdk4).toFixed(2)}, tus/SDK(1) ${(tus / sdk1).toFixed(2)}; RSS growth ${(rss.growth / 1048576).toFixed(1)} MiB`);
      }
    }
    // Whether the app hashed the last tus upload on the way in (storage/upload-digest.ts) or had to read it back.
    const { db } = await import('@/db/client');
    const last = await db('clips').orderBy('created_at', 'desc').first<{ upload_id: string; sha256: string } | undefined>('upload_id', 'sha256');
    const streamed = last ? await new S3ClipStore(settings).verifiedSha256(last.upload_id, SIZE) : null;
    const digestNote = streamed === null ? 'read back (no verified digest)' : streamed === last?.sha256 ? 'hashed on the way in, no read-back' : 'MISMATCH';
    const t2 = performance.now();
    const readBack = await client.send(new GetObjectCommand({ Bucket: settings.bucket, Key: 'sdk-1.bin' }));
    await sha256Of(readBack.Body as Readable);
    const readMs = performance.now() - t2;

    const median = (xs: number[]) => {
      const s = [...xs].sort((x, y) => x - y);
      const m = Math.floor(s.length / 2);
      return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
    };
    const spread = (xs: number[], digits: number) => (xs.length > 1 ? ` (${Math.min(...xs).toFixed(digits)}–${Math.max(...xs).toFixed(digits)} over ${xs.length} runs)` : '');
    const tusMs = median(runs.map((r) => r.tusMs));
    const sdk4Ms = median(runs.map((r) => r.sdk4Ms));
    const sdk1Ms = median(runs.map((r) => r.sdk1Ms));
    const ratio4 = runs.map((r) => r.sdk4Ms / r.tusMs);
    const ratio1 = runs.map((r) => r.sdk1Ms / r.tusMs);
    const growth = Math.max(...runs.map((r) => r.growth));

    const pair = async (ports: [number, number]) => {
      const t = performance.now();
      await Promise.all(ports.map((p) => tusUpload(p, src, cookie, metadata)));
      return performance.now() - t;
    };
    let oneProcMs = 0;
    let twoProcMs = 0;
    if (PAIRS) {
      oneProcMs = await pair([PORT_A, PORT_A]);
      apps.push(await startApp(PORT_B, appEnv(settings)));
      await tusUpload(PORT_B, warm, cookie, metadata);
      twoProcMs = await pair([PORT_A, PORT_B]);
    }

    const tus = mibps(SIZE, tusMs);
    const sdk4 = mibps(SIZE, sdk4Ms);
    const sdk1 = mibps(SIZE, sdk1Ms);
    console.log(`${MIB} MiB into S3 (${settings.endpoint}), loopback, ${new Date().toISOString()}, load average now ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}${RUNS > 1 ? '; medians' : ''}:`);
    console.log(`  tus into one app (browser chunks, clip SHA-256 included): ${tus.toFixed(0)} MiB/s (${(tusMs / 1000).toFixed(2)} s); the SHA-256: ${digestNote}`);
    console.log(`  AWS SDK multipart, 8 MiB parts, 4 at a time (SDK default):  ${sdk4.toFixed(0)} MiB/s (${(sdk4Ms / 1000).toFixed(2)} s)`);
    console.log(`  AWS SDK multipart, 8 MiB parts, 1 at a time:                ${sdk1.toFixed(0)} MiB/s (${(sdk1Ms / 1000).toFixed(2)} s)`);
    console.log(`  tus/SDK(4) ${median(ratio4).toFixed(2)}${spread(ratio4, 2)}   tus/SDK(1) ${median(ratio1).toFixed(2)}${spread(ratio1, 2)}   (goal >= 0.80)`);
    console.log(`  read back from S3 with SHA-256 (what a finish without a verified digest adds): ${mibps(SIZE, readMs).toFixed(0)} MiB/s (${(readMs / 1000).toFixed(2)} s)`);
    console.log(`  app RSS: ${(base / 1048576).toFixed(0)} MiB before, peak growth ${(growth / 1048576).toFixed(1)} MiB during the upload${RUNS > 1 ? 's (largest)' : ''} (goal <= 64 MiB)`);
    if (PAIRS) {
      console.log(`  two uploads at once, one process:   ${mibps(2 * SIZE, oneProcMs).toFixed(0)} MiB/s aggregate (${(oneProcMs / 1000).toFixed(2)} s)`);
      console.log(`  two uploads at once, two processes: ${mibps(2 * SIZE, twoProcMs).toFixed(0)} MiB/s aggregate (${(twoProcMs / 1000).toFixed(2)} s)`);
    }
  } finally {
    for (const app of apps) app.kill('SIGTERM');
    await proxy?.close();
    await remove();
    await emptyBucket(client, settings.bucket).catch((err: unknown) => console.error('bucket clean-up', err));
    client.destroy();
    await server.stop();
    fs.rmSync(WORK, { recursive: true, force: true });
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
