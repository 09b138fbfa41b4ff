// Board API benchmark (issue: episodes board). Run against a server started by `npm start`:
//   node --require ./bench/lib/allow-server-modules.cjs --import tsx bench/running-order/run.ts
// Prints SQL statements per board request for 10 and 200 segments, and p50/p95 latency at 16 concurrent connections.
import { readFileSync } from 'node:fs';
import { randomUUID } from 'node:crypto';
import { encode } from 'next-auth/jwt';
import { NextRequest } from 'next/server';

const PORT = process.env.KERFLINE_PG_PORT ?? '54329';
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PORT}/kerfline`;
process.env.NEXTAUTH_SECRET ??= readFileSync('.data/session-secret', 'utf8').trim();
const BASE = process.env.BENCH_URL ?? 'http://127.0.0.1:3000';
const SEGMENTS = [10, 200];

async function main() {
  const { db } = await import('@/db/client');
  const { createChannel } = await import('@/lib/channels/queries');
  const { createEpisode } = await import('@/lib/episodes/queries');
  const { GET } = await import('@/app/api/channels/[channel]/episodes/[episodeId]/running-order/route');
  const { generateNKeysBetween } = await import('fractional-indexing');

  const [user] = await db('users')
    .insert({ email: `bench-${randomUUID()}@bench.kerfline.test`, name: 'Bench host', password_hash: 'x' })
    .returning<{ id: string; email: string; name: string }[]>(['id', 'email', 'name']);
  if (!user) throw new Error('no user');
  const channel = await createChannel('Board bench', user.id);
  const cookie = `next-auth.session-token=${await encode({ token: { sub: user.id }, secret: process.env.NEXTAUTH_SECRET ?? '' })}`;

  let statements = 0;
  db.on('query', () => statements++);
  try {
    const episodes: { n: number; id: string }[] = [];
    for (const n of SEGMENTS) {
      const episode = await createEpisode(channel.id, { title: `${n} segments`, premise: '', stage: 'outline', targetSeconds: 3600, shootDate: null, publishDate: null });
      const keys = generateNKeysBetween(null, null, n);
      await db('segments').insert(
        keys.map((position, i) => ({ episode_id: episode.id, position, kind: 'build', level: (i % 3) + 1, title: `Segment ${i + 1}`, word_count: 120 + (i % 50), action_seconds: i % 90 })),
      );
      episodes.push({ n, id: episode.id });
    }

    console.log('SQL statements per board request (Knex query events, in-process handler):');
    for (const e of episodes) {
      statements = 0;
      const res = await GET(new NextRequest(`${BASE}/api/x`, { headers: { cookie } }), { params: Promise.resolve({ channel: channel.slug, episodeId: e.id }) });
      if (res.status !== 200) throw new Error(`board answered ${res.status}`);
      console.log(`  ${String(e.n).padStart(4)} segments: ${statements} statements`);
    }

    const big = episodes.at(-1)!;
    const url = `${BASE}/api/channels/${channel.slug}/episodes/${big.id}/running-order`;
    const probe = await fetch(url, { headers: { cookie } });
    if (probe.status !== 200) throw new Error(`${url} answered ${probe.status}; is \`npm start\` running with this database?`);
    const { latencies, failures, seconds } = await load(url, cookie, { connections: 16, durationMs: 10_000 });
    console.log(`Latency over HTTP, ${big.n} segments, 16 concurrent connections, ${seconds.toFixed(1)} s (${latencies.length} requests, ${failures} failed):`);
    console.log(`  p50 ${percentile(latencies, 50).toFixed(1)} ms   p95 ${percentile(latencies, 95).toFixed(1)} ms   p99 ${percentile(latencies, 99).toFixed(1)} ms   ${Math.round(latencies.length / seconds)} req/s`);
  } finally {
    await db('channels').where({ id: channel.id }).delete();
    await db('users').where({ id: user.id }).delete();
    await db.destroy();
  }
}

/** A closed loop: each of `connections` workers sends its next request when the last one answers. */
async function load(url: string, cookie: string, opts: { connections: number; durationMs: number }) {
  const latencies: number[] = [];
  let failures = 0;
  const start = performance.now();
  const deadline = start + opts.durationMs;
  const worker = async () => {
    while (performance.now() < deadline) {
      const t = performance.now();
      const res = await fetch(url, { headers: { cookie } }).catch(() => null);
      if (!res || res.status !== 200) failures++;
      await res?.arrayBuffer();
      latencies.push(performance.now() - t);
    }
  };
  await Promise.all(Array.from({ length: opts.connections }, worker));
  return { latencies, failures, seconds: (performance.now() - start) / 1000 };
}

/** Nearest-rank percentile. */
function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.max(0, Math.ceil((p / 100) * sorted.length) - 1)] ?? 0;
}

void main().catch((err: unknown) => {
  console.error(err);
  process.exitCode = 1;
});
