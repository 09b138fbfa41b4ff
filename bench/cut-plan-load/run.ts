// Cut-plan load probe (issue 12). Run against a server started by `npm start`:
//   node --require ./bench/lib/allow-server-modules.cjs --import tsx bench/cut-plan-load/run.ts
// Fires waves of 12 parallel cut-plan requests (episodes of 8 stock items x 9 parts) while it measures
// the p95 of another route (an episode's running-order board); goal: p95 under load <= 3x idle p95.
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { encode } from 'next-auth/jwt';

const PORT = process.env.KERFLINE_PG_PORT ?? '54329';
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PORT}/kerfline`;
process.env.NEXTAUTH_SECRET ??= readFileSync('.data/session-secret', 'utf8').trim();
const BASE = process.env.BENCH_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const PROBE_CONNECTIONS = 4;

type Target = { slug: string; episodeId: string; cookie: string };

async function main() {
  const { db } = await import('@/db/client');
  const { createChannel } = await import('@/lib/channels/queries');
  const { makeLoadEpisode } = await import('@/tests/integration/cut-plan-fixtures');

  // Six channels with two episodes each: twelve different plans, none refused by the per-channel limit.
  const users: string[] = [];
  const channels: string[] = [];
  const targets: Target[] = [];
  try {
    for (let c = 0; c < 6; c++) {
      const [user] = await db('users')
        .insert({ email: `bench-${randomUUID()}@bench.kerfline.test`, name: 'Bench host', password_hash: 'x' })
        .returning<{ id: string }[]>(['id']);
      if (!user) throw new Error('no user');
      users.push(user.id);
      const channel = await createChannel(`Plan load ${c + 1}`, user.id);
      channels.push(channel.id);
      const cookie = `next-auth.session-token=${await encode({ token: { sub: user.id }, secret: process.env.NEXTAUTH_SECRET ?? '' })}`;
      for (let e = 0; e < 2; e++) targets.push({ slug: channel.slug, episodeId: (await makeLoadEpisode({ channel }, 1000 + c * 10 + e)).episode.id, cookie });
    }
    const probe = targets[0]!;
    const probeUrl = `${BASE}/api/channels/${probe.slug}/episodes/${probe.episodeId}/board`;
    const check = await fetch(probeUrl, { headers: { cookie: probe.cookie } });
    if (check.status !== 200) throw new Error(`${probeUrl} answered ${check.status}; is \`npm start\` running with this database?`);

    const idle = await measure(probeUrl, probe.cookie, SECONDS * 1000, null);
    let kerf = 0;
    const plans: { ms: number; status: number }[] = [];
    // Each wave changes every channel's kerf first, so no plan comes from the cache.
    const waves = async (stop: () => boolean) => {
      while (!stop()) {
        kerf = (kerf % 60) + 1;
        const seen = new Set<string>();
        for (const t of targets) {
          if (seen.has(t.slug)) continue;
          seen.add(t.slug);
          await fetch(`${BASE}/api/channels/${t.slug}/cut-settings`, {
            method: 'PATCH',
            headers: { cookie: t.cookie, 'content-type': 'application/json', origin: BASE },
            body: JSON.stringify({ kerfIn: `${kerf}/256` }),
          });
        }
        await Promise.all(
          targets.map(async (t) => {
            const started = performance.now();
            const res = await fetch(`${BASE}/api/channels/${t.slug}/episodes/${t.episodeId}/cut-plan`, { headers: { cookie: t.cookie } });
            await res.arrayBuffer();
            plans.push({ ms: performance.now() - started, status: res.status });
          }),
        );
      }
    };
    const loaded = await measure(probeUrl, probe.cookie, SECONDS * 1000, waves);

    const idleP95 = percentile(idle.latencies, 95);
    const loadP95 = percentile(loaded.latencies, 95);
    const statuses = plans.reduce<Record<number, number>>((a, p) => ({ ...a, [p.status]: (a[p.status] ?? 0) + 1 }), {});
    console.log(`Other route: GET …/board, ${PROBE_CONNECTIONS} connections, ${SECONDS} s each phase`);
    console.log(`  idle:  p50 ${percentile(idle.latencies, 50).toFixed(1)} ms  p95 ${idleP95.toFixed(1)} ms  p99 ${percentile(idle.latencies, 99).toFixed(1)} ms  (${idle.latencies.length} requests)`);
    console.log(`  load:  p50 ${percentile(loaded.latencies, 50).toFixed(1)} ms  p95 ${loadP95.toFixed(1)} ms  p99 ${percentile(loaded.latencies, 99).toFixed(1)} ms  max ${Math.max(...loaded.latencies).toFixed(1)} ms  (${loaded.latencies.length} requests)`);
    console.log(`  p95 under load / idle p95 = ${(loadP95 / idleP95).toFixed(2)} (goal <= 3)`);
    console.log(`Cut-plan requests: ${plans.length} in waves of ${targets.length}, statuses ${JSON.stringify(statuses)}, p50 ${percentile(plans.map((p) => p.ms), 50).toFixed(0)} ms, max ${Math.max(...plans.map((p) => p.ms)).toFixed(0)} ms`);
  } finally {
    await db('channels').whereIn('id', channels).delete();
    await db('users').whereIn('id', users).delete();
    await db.destroy();
  }
}

/** Closed-loop GETs on `url` from PROBE_CONNECTIONS connections for `ms`, with `load` running beside them. */
async function measure(url: string, cookie: string, ms: number, load: ((stop: () => boolean) => Promise<void>) | null) {
  const latencies: number[] = [];
  const end = performance.now() + ms;
  const stop = () => performance.now() > end;
  const worker = async () => {
    while (!stop()) {
      const started = performance.now();
      const res = await fetch(url, { headers: { cookie } });
      await res.arrayBuffer();
      if (res.status === 200) latencies.push(performance.now() - started);
    }
  };
  await Promise.all([...Array.from({ length: PROBE_CONNECTIONS }, worker), load ? load(stop) : Promise.resolve()]);
  return { latencies };
}

function percentile(values: number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? Number.NaN;
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
