// Moves clips from the disk store to an S3-compatible bucket, checking every copy's SHA-256 (docs/scaling.md):
//   DATABASE_URL=… UPLOAD_DIR=… S3_ENDPOINT=… S3_BUCKET=… S3_ACCESS_KEY_ID=… S3_SECRET_ACCESS_KEY=… \
//     node --conditions=react-server --import tsx scripts/move-clips-to-s3.ts [--channel <uuid>] [--remove-local]
// Safe to run again: clips already in the bucket with the right hash are skipped. Exit code 1 when any clip
// is missing, differs on disk from its recorded hash, or its copy did not check out.
import { db } from '@/db/client';
import { posterDirectory, s3Settings, uploadDirectory } from '@/storage/config';
import { DiskClipStore } from '@/storage/disk-store';
import { moveClipsToS3, type MoveOutcome } from '@/storage/move-to-s3';
import { S3ClipStore } from '@/storage/s3-store';

const arg = (name: string) => {
  const i = process.argv.indexOf(name);
  return i > 0 ? process.argv[i + 1] : undefined;
};

async function main(): Promise<number> {
  const from = new DiskClipStore(uploadDirectory(), posterDirectory());
  const to = new S3ClipStore(s3Settings());
  const order: MoveOutcome[] = ['copied', 'already there', 'missing', 'source differs', 'copy differs'];
  const counts = new Map<MoveOutcome, number>(order.map((o) => [o, 0]));
  const reports = await moveClipsToS3(from, to, {
    channelId: arg('--channel'),
    removeSource: process.argv.includes('--remove-local'),
    onClip: (r) => {
      counts.set(r.outcome, (counts.get(r.outcome) ?? 0) + 1);
      if (r.outcome !== 'copied' && r.outcome !== 'already there') console.error(`clip ${r.clipId} (upload ${r.uploadId}): ${r.outcome}`);
    },
  });
  const summary = [...counts].filter(([, n]) => n > 0).map(([k, n]) => `${n} ${k}`);
  console.log(`${reports.length} clip(s): ${summary.join(', ') || 'nothing to move'}`);
  return reports.every((r) => r.outcome === 'copied' || r.outcome === 'already there') ? 0 : 1;
}

main()
  .then((code) => (process.exitCode = code))
  .catch((err: unknown) => {
    console.error(err);
    process.exitCode = 1;
  })
  .finally(() => void db.destroy());
