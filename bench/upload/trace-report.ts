// Reads what `s3.ts --trace DIR` wrote and prints where a tus upload's time went, PATCH by PATCH:
//   npx tsx bench/upload/trace-report.ts DIR
// patches.log (client: PATCH start/end), s3.log (every S3 request the app made, through the logging proxy).
import fs from 'node:fs';
import path from 'node:path';

type Call = { op: string; key: string; status: number; t0: number; t1: number; bytes: number };

const dir = path.resolve(process.argv[2] ?? 'bench-trace');
const lines = (f: string) => fs.readFileSync(path.join(dir, f), 'utf8').split('\n').filter(Boolean);
const patches = lines('patches.log')
  .map((l) => l.split(' '))
  .filter((f) => f[0] === 'PATCH')
  .map((f) => ({ t0: Number(f[1]), t1: Number(f[2]), offset: Number(f[5]) }));
const calls: Call[] = lines('s3.log').map((l) => {
  const f = l.split(' ');
  // UploadPart carries its number as a second word.
  const op = f[0] === 'UploadPart' ? `${f[0]} ${f[1]}` : f[0]!;
  const rest = f[0] === 'UploadPart' ? f.slice(2) : f.slice(1);
  return { op, key: rest[0]!, status: Number(rest[1]), t0: Number(rest[2]), t1: Number(rest[3]), bytes: Number(rest[4]) };
});
// The large upload only: its PATCHes move the offset by more than 1 MiB.
const big = patches.filter((p, i) => p.offset - (i > 0 ? patches[i - 1]!.offset : 0) > 1024 * 1024);
const sum = { total: 0, beforeFirstPart: 0, afterLastPart: 0, smallCalls: 0, partBusy: 0 };
for (const p of big) {
  const inside = calls.filter((c) => c.t0 >= p.t0 && c.t1 <= p.t1 + 5);
  const parts = inside.filter((c) => c.op.startsWith('UploadPart'));
  const small = inside.filter((c) => !c.op.startsWith('UploadPart'));
  const firstPart = Math.min(...parts.map((c) => c.t0));
  const lastPart = Math.max(...parts.map((c) => c.t1));
  // Time with at least one part on the wire.
  let busy = 0;
  let edge = 0;
  for (const c of [...parts].sort((a, b) => a.t0 - b.t0)) {
    busy += Math.max(0, c.t1 - Math.max(edge, c.t0));
    edge = Math.max(edge, c.t1);
  }
  const total = p.t1 - p.t0;
  sum.total += total;
  sum.beforeFirstPart += firstPart - p.t0;
  sum.afterLastPart += p.t1 - lastPart;
  sum.partBusy += busy;
  sum.smallCalls += small.reduce((a, c) => a + c.t1 - c.t0, 0);
  const smallText = small.map((c) => `${c.op}${c.key.endsWith('.part') ? '(.part)' : c.key.endsWith('.info') ? '(.info)' : ''}=${c.t1 - c.t0}`).join(' ');
  const partText = parts.map((c) => `${c.t0 - p.t0}+${c.t1 - c.t0}`).join(' ');
  console.log(`PATCH →${(p.offset / 1048576).toFixed(0)} MiB ${total} ms: first part at ${firstPart - p.t0} ms, last part ends ${p.t1 - lastPart} ms before the answer; small S3 calls: ${smallText}; parts (start+ms): ${partText}`);
}
const gaps = big.slice(1).reduce((a, p, i) => a + p.t0 - big[i]!.t1, 0);
console.log(
  `\n${big.length} PATCHes, ${(sum.total / 1000).toFixed(1)} s in PATCHes, ${(gaps / 1000).toFixed(1)} s between them; ` +
    `before the first part of each: ${(sum.beforeFirstPart / 1000).toFixed(1)} s; small S3 calls: ${(sum.smallCalls / 1000).toFixed(1)} s; ` +
    `a part on the wire: ${(sum.partBusy / 1000).toFixed(1)} s; after the last part: ${(sum.afterLastPart / 1000).toFixed(1)} s`,
);
