import 'server-only';
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { createWriteStream } from 'node:fs';
import { listStoredClips, type StoredClip } from '@/lib/clips/queries';
import type { ClipStore } from './clip-store';
import { sha256Of } from './ingest';
import type { S3ClipStore } from './s3-store';

export type MoveOutcome = 'copied' | 'already there' | 'missing' | 'source differs' | 'copy differs';
export type MoveReport = { clipId: string; uploadId: string; outcome: MoveOutcome; posterCopied: boolean };

/**
 * Copies every clip's bytes (and poster) from `from` into the bucket of `to`, then reads the copy back
 * and checks its SHA-256 against the one recorded when the clip was uploaded. Clips already in the bucket
 * with the right hash are left alone, so a run can be repeated until every clip reports 'copied' or
 * 'already there'. With `removeSource`, a clip's local bytes go only after its copy checked out.
 * Unfinished uploads are not moved: they finish where they began or start again.
 */
export async function moveClipsToS3(
  from: ClipStore,
  to: S3ClipStore,
  opts: { channelId?: string; removeSource?: boolean; onClip?: (r: MoveReport) => void } = {},
): Promise<MoveReport[]> {
  const reports: MoveReport[] = [];
  for (let afterId: string | undefined; ; ) {
    const page = await listStoredClips({ channelId: opts.channelId, afterId, limit: 200 });
    if (page.length === 0) break;
    for (const clip of page) {
      const report = await moveOne(from, to, clip, opts.removeSource ?? false);
      opts.onClip?.(report);
      reports.push(report);
    }
    afterId = page[page.length - 1]!.id;
  }
  return reports;
}

async function moveOne(from: ClipStore, to: S3ClipStore, clip: StoredClip, removeSource: boolean): Promise<MoveReport> {
  const report = (outcome: MoveOutcome, posterCopied = false): MoveReport => ({ clipId: clip.id, uploadId: clip.uploadId, outcome, posterCopied });
  const there = await to.stat(clip.uploadId);
  let outcome: MoveOutcome = 'already there';
  if (!there || there.size !== clip.sizeBytes || (await sha256Of(await to.read(clip.uploadId))) !== clip.sha256) {
    const local = await from.stat(clip.uploadId);
    if (!local) return report('missing');
    // Bytes that changed on disk since the upload are reported, never spread further.
    if ((await sha256Of(await from.read(clip.uploadId))) !== clip.sha256) return report('source differs');
    await to.putFinished(clip.uploadId, await from.read(clip.uploadId), local.size);
    if ((await sha256Of(await to.read(clip.uploadId))) !== clip.sha256) return report('copy differs');
    outcome = 'copied';
  }
  const posterCopied = clip.hasPoster ? await copyPoster(from, to, clip.id) : false;
  if (removeSource) {
    await from.remove(clip.uploadId);
    if (clip.hasPoster) await from.removePoster(clip.id);
  }
  return report(outcome, posterCopied);
}

async function copyPoster(from: ClipStore, to: ClipStore, clipId: string): Promise<boolean> {
  if (await to.readPoster(clipId).then((r) => (r?.destroy(), r !== null))) return false;
  const poster = await from.readPoster(clipId);
  if (!poster) return false;
  const tmp = path.join(await fs.mkdtemp(path.join(os.tmpdir(), 'kerfline-move-')), `${clipId}.jpg`);
  try {
    await pipeline(poster, createWriteStream(tmp));
    await to.savePoster(clipId, tmp);
    return true;
  } finally {
    await fs.rm(path.dirname(tmp), { recursive: true, force: true });
  }
}
