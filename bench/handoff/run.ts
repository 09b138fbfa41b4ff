// Handoff benchmark (issue 14). Needs PostgreSQL with a migrated Kerfline database (`npm start`):
//   nice node --require ./bench/lib/allow-server-modules.cjs --import tsx bench/handoff/run.ts [--gib 5.2]
// Part 1: lock and diff of 10 and 200 segments (10 shots and one clip each): SQL statements per request
// (Knex query events) and time. Part 2: the clip package of >= 5 GB of clips (sparse files, one over
// 4 GiB for ZIP64) through the route handler, against a plain streamed read of the same files, and the
// process's RSS growth while it streams. Both streams go to a sink, so the disk holds no copy.
// Everything it made (rows and files) is removed at the end.
import { randomBytes, randomUUID } from 'node:crypto';
import { createReadStream, mkdirSync, readFileSync, rmSync, writeFileSync, truncateSync } from 'node:fs';
import path from 'node:path';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { crc32 } from 'node:zlib';

const PORT = process.env.KERFLINE_PG_PORT ?? '54329';
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PORT}/kerfline`;
process.env.NEXTAUTH_SECRET ??= readFileSync('.data/session-secret', 'utf8').trim();
const UPLOADS = path.resolve('.data/bench-handoff-uploads');
process.env.UPLOAD_DIR = UPLOADS;
process.env.STORAGE = 'disk';
const gibArg = process.argv.indexOf('--gib');
const TOTAL_GIB = gibArg > 0 ? Number(process.argv[gibArg + 1]) : 5.2;
const GIB = 1024 ** 3;

/** CRC-32 of `size` zero bytes (a sparse file reads as zeros). */
function crcOfZeros(size: number): number {
  const block = Buffer.alloc(16 * 1024 * 1024);
  let crc = 0;
  for (let left = size; left > 0; left -= block.length) crc = crc32(left >= block.length ? block : block.subarray(0, left), crc);
  return crc;
}

const sink = () => new Writable({ write: (_chunk, _enc, cb) => cb() });
const mib = (n: number) => (n / 1024 ** 2).toFixed(1);

async function main() {
  const { db } = await import('@/db/client');
  const { NextRequest } = await import('next/server');
  const { encode } = await import('next-auth/jwt');
  const { createChannel } = await import('@/lib/channels/queries');
  const { createEpisode } = await import('@/lib/episodes/queries');
  const lockRoute = await import('@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/route');
  const diffRoute = await import('@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/diff/route');
  const exportRoute = await import('@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/[version]/exports/[format]/route');
  const { generateNKeysBetween } = await import('fractional-indexing');

  mkdirSync(UPLOADS, { recursive: true });
  const [user] = await db('users')
    .insert({ email: `bench-${randomUUID()}@bench.kerfline.test`, name: 'Bench host', password_hash: 'x' })
    .returning<{ id: string }[]>(['id']);
  if (!user) throw new Error('no user');
  const channel = await createChannel(`Handoff bench ${randomUUID().slice(0, 6)}`, user.id);
  const cookie = `next-auth.session-token=${await encode({ token: { sub: user.id }, secret: process.env.NEXTAUTH_SECRET ?? '' })}`;
  // Origin as a Kerfline page sends it: state-changing requests without one are refused (issue 12); NextRequest turns 127.0.0.1 into localhost, so both say localhost.
  const req = (url: string, method = 'GET', body?: unknown) =>
    new NextRequest(`http://localhost/api/x${url}`, { method, headers: { cookie, origin: 'http://localhost', 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
  const ctx = (params: Record<string, string>) => ({ params: Promise.resolve({ channel: channel.slug, ...params }) });

  let statements = 0;
  db.on('query', () => statements++);
  const measure = async <T>(fn: () => Promise<T>) => {
    statements = 0;
    const t = performance.now();
    const out = await fn();
    return { out, ms: performance.now() - t, statements };
  };

  try {
    console.log('Lock and diff (in-process route handlers; statements counted with Knex query events):');
    for (const n of [10, 200]) {
      const episode = await createEpisode(channel.id, { title: `${n} segments`, premise: '', stage: 'edit', targetSeconds: 3600, shootDate: null, publishDate: null });
      const keys = generateNKeysBetween(null, null, n);
      const words = (i: number) => Array.from({ length: 120 }, (_, w) => `word${(w * 7 + i) % 97}`).join(' ');
      const doc = (text: string) => JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });
      const segs: { id: string }[] = await db('segments')
        .insert(keys.map((position, i) => ({ episode_id: episode.id, position, kind: 'build', level: (i % 3) + 1, title: `Segment ${i + 1}`, script: doc(words(i)), script_text: words(i), word_count: 120, action_seconds: 30 })))
        .returning('id');
      const shotKeys = generateNKeysBetween(null, null, 10);
      const shots: { id: string; segment_id: string }[] = await db('shots')
        .insert(segs.flatMap((s) => shotKeys.map((k, j) => ({ segment_id: s.id, position: k, board_position: k, description: `Shot ${j + 1}`, state: j % 3 ? 'planned' : 'captured' }))))
        .returning(['id', 'segment_id']);
      await db('clips').insert(
        shots.filter((_, i) => i % 10 === 0).map((s) => ({ upload_id: randomBytes(16).toString('hex'), segment_id: s.segment_id, shot_id: s.id, original_name: 'A001.mov', mime_type: 'video/quicktime', size_bytes: 1000, sha256: '0'.repeat(64), duration_seconds: 12.5, frame_rate: 29.97 })),
      );
      const lock1 = await measure(() => lockRoute.POST(req('', 'POST', { note: '' }), ctx({ episodeId: episode.id })));
      await db('segments').whereIn('id', segs.filter((_, i) => i % 4 === 0).map((s) => s.id)).update({ script_text: db.raw(`'Changed opening. ' || script_text`) });
      await db('shots').whereIn('id', shots.filter((_, i) => i % 5 === 1).map((s) => s.id)).update({ state: 'captured' });
      const lock2 = await measure(() => lockRoute.POST(req('', 'POST', { note: '' }), ctx({ episodeId: episode.id })));
      const diff = await measure(() => diffRoute.GET(req('?from=1&to=2'), ctx({ episodeId: episode.id })));
      if (lock1.out.status !== 201 || lock2.out.status !== 201 || diff.out.status !== 200) throw new Error(`lock or diff failed: ${lock1.out.status} ${await lock1.out.text()} ${lock2.out.status} ${diff.out.status}`);
      console.log(
        `  ${String(n).padStart(3)} segments, ${shots.length} shots: lock ${lock1.statements} statements (v1 ${lock1.ms.toFixed(0)} ms, v2 ${lock2.ms.toFixed(0)} ms); diff ${diff.statements} statements, ${diff.ms.toFixed(0)} ms`,
      );
    }

    console.log(`\nClip package of ${TOTAL_GIB} GiB (sparse files; both reads go to a sink):`);
    const episode = await createEpisode(channel.id, { title: 'Package bench', premise: '', stage: 'edit', targetSeconds: 600, shootDate: null, publishDate: null });
    const [segKey] = generateNKeysBetween(null, null, 1);
    const [seg] = await db('segments').insert({ episode_id: episode.id, position: segKey, kind: 'build', level: 1, title: 'Glue-up' }).returning<{ id: string }[]>('id');
    const big = Math.floor(4.3 * GIB);
    const sizes = [big, ...Array.from({ length: 4 }, () => Math.floor((TOTAL_GIB * GIB - big) / 4))];
    const files: string[] = [];
    for (const [i, size] of sizes.entries()) {
      const uploadId = randomBytes(16).toString('hex');
      // Sparse files straight into the disk store's folder (UPLOAD_DIR above), as finished uploads lie there.
      const file = path.join(UPLOADS, uploadId);
      writeFileSync(file, '');
      truncateSync(file, size);
      files.push(file);
      // The CRC-32 ingest records for every upload (storage/ingest.ts), so the package does not compute it.
      await db('clips').insert({ upload_id: uploadId, segment_id: seg!.id, original_name: `C00${i}.mov`, mime_type: 'video/quicktime', size_bytes: size, sha256: '0'.repeat(64), crc32: crcOfZeros(size), duration_seconds: 60, frame_rate: 25 });
    }
    await lockRoute.POST(req('', 'POST', { note: '' }), ctx({ episodeId: episode.id }));
    const total = sizes.reduce((a, b) => a + b, 0);

    // The plain read runs before and after the package and the ratio takes their mean, so a change in
    // the machine's load during the run (a shared box) weighs on both sides alike.
    const plainRead = async () => {
      const t0 = performance.now();
      for (const f of files) await pipeline(createReadStream(f, { highWaterMark: 1024 * 1024 }), sink());
      return (performance.now() - t0) / 1000;
    };
    const plainBefore = await plainRead();

    global.gc?.();
    const base = process.memoryUsage().rss;
    let peak = base;
    const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 50);
    const t1 = performance.now();
    statements = 0;
    const res = await exportRoute.GET(req(''), ctx({ episodeId: episode.id, version: '1', format: 'zip' }));
    const pkgStatements = statements;
    let bytes = 0;
    const reader = res.body!.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      bytes += value.byteLength;
    }
    const pkgS = (performance.now() - t1) / 1000;
    clearInterval(timer);
    const plainAfter = await plainRead();
    const plainS = (plainBefore + plainAfter) / 2;
    const length = Number(res.headers.get('content-length'));
    console.log(`  clips: ${sizes.length}, ${(total / 1e9).toFixed(2)} GB (largest ${(big / GIB).toFixed(2)} GiB); package ${(bytes / 1e9).toFixed(2)} GB, Content-Length ${length === bytes ? 'matches' : `MISMATCH ${length}`}; ${pkgStatements} SQL statements`);
    console.log(`  plain streamed read: ${mib(total / plainS)} MiB/s (mean of ${plainBefore.toFixed(1)} s before and ${plainAfter.toFixed(1)} s after the package)`);
    console.log(`  clip package:        ${mib(bytes / pkgS)} MiB/s (${pkgS.toFixed(1)} s)   ratio ${((bytes / pkgS) / (total / plainS)).toFixed(2)} (goal >= 0.8)`);
    console.log(`  RSS growth while streaming: ${mib(peak - base)} MiB (goal <= 64 MiB)`);
  } finally {
    await db('channels').where({ id: channel.id }).delete();
    await db('users').where({ id: user.id }).delete();
    await db.destroy();
    rmSync(UPLOADS, { recursive: true, force: true });
  }
}

main().catch((err: unknown) => {
  console.error(err);
  rmSync(UPLOADS, { recursive: true, force: true });
  process.exitCode = 1;
});
