// `npx tsx bench/sponsor-checks/run.ts`: how long the live checks of one sponsor read take, on the
// request thread, for scripts from a normal read to a whole hour of speech. Prints numbers only.
import { performance } from 'node:perf_hooks';
import { forecastEpisode } from '@/lib/runtime';
import { checkDeliverable } from '@/lib/sponsor-checks';

const words = ['plane', 'the', 'edge', 'square', 'glue', 'clamp', 'overnight', 'sand', 'to', 'two', 'twenty', 'grit'];
const script = (n: number) => Array.from({ length: n }, (_, i) => words[i % words.length]).join(' ') + ' This video is sponsored by Brightgrain Abrasives. Use code KERF10.';

for (const n of [200, 2_000, 9_000, 30_000]) {
  const text = script(n);
  const segments = Array.from({ length: 200 }, (_, i) => ({ id: `s${i}`, wordCount: i === 100 ? n : 150, actionSeconds: 30 }));
  const runs = 200;
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    const f = forecastEpisode(segments, 150);
    const read = f.segments[100]!;
    checkDeliverable({
      read: { startSeconds: read.startSeconds, totalSeconds: read.totalSeconds, scriptText: text },
      episodeSeconds: f.totalSeconds,
      wordsPerMinute: 150,
      placement: { kind: 'within_percent', percent: 50 },
      range: { minSeconds: 60, maxSeconds: 90 },
      mustSay: ['code KERF10', 'brightgrain abrasives', 'free shipping'],
      disclosure: 'This video is sponsored by Brightgrain Abrasives',
    });
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!.toFixed(3);
  console.log(`${String(n).padStart(6)} words in the read, 200 segments: p50 ${q(0.5)} ms, p95 ${q(0.95)} ms, max ${q(1)} ms (${runs} runs)`);
}
