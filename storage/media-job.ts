import 'server-only';
import { execFile } from 'node:child_process';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { claimClipJob, completeClipJob, retryClipJob, type ClipJob } from '@/lib/clips/queries';
import { parseProbe, type MediaInfo } from '@/lib/clips/probe';
import { POSTER_FAILED, probeFailureNote } from '@/lib/clips/probe-note';
import type { ClipStore } from './clip-store';

const run = promisify(execFile);
type ExecError = Error & { code?: string | number; stderr?: string };

// People see plain notes (lib/clips/probe-note.ts); the tools' own words go to the server log.
const logToolFailure = (what: string, clipId: string, err: ExecError) =>
  console.error(`[clips] ${what} failed for clip ${clipId}:`, (err.stderr ?? '').trim() || err.message);

async function probe(file: string): Promise<MediaInfo> {
  const { stdout } = await run('ffprobe', ['-v', 'error', '-print_format', 'json', '-show_format', '-show_streams', file], { timeout: 120_000, maxBuffer: 8 * 1024 * 1024 });
  return parseProbe(JSON.parse(stdout));
}

/** One frame, 480 px wide, a second in (or the first frame of a short clip or a still). */
async function poster(file: string, info: MediaInfo, out: string): Promise<void> {
  const seek = info.durationSeconds !== null && info.durationSeconds > 2 ? ['-ss', '1'] : [];
  await run('ffmpeg', ['-v', 'error', '-y', ...seek, '-i', file, '-frames:v', '1', '-vf', 'scale=480:-2', out], { timeout: 120_000 });
}

export async function processClipJob(store: ClipStore, job: ClipJob): Promise<void> {
  // A local path, or a short-lived presigned URL: ffprobe and ffmpeg read ranges over HTTP, never a full local copy.
  const file = await store.mediaSource(job.uploadId);
  let info: MediaInfo;
  try {
    info = await probe(file);
  } catch (err) {
    const e = err as ExecError;
    if (e.code === 'ENOENT') return completeClipJob(job, { state: 'unavailable', note: 'ffprobe is not installed on the server, so duration and resolution are unknown.', poster: false });
    if (typeof e.code === 'number' || e instanceof SyntaxError) {
      logToolFailure('ffprobe', job.clipId, e);
      return completeClipJob(job, { state: 'failed', note: probeFailureNote(e.stderr ?? ''), poster: false });
    }
    return retryClipJob(job, e.message);
  }
  const hasPicture = info.width !== null && !job.mimeType.startsWith('audio/');
  let made = false;
  let note: string | null = null;
  if (hasPicture) {
    const out = path.join(os.tmpdir(), `kerfline-poster-${job.clipId}.jpg`);
    try {
      await poster(file, info, out);
      await store.savePoster(job.clipId, out);
      made = true;
    } catch (err) {
      logToolFailure('ffmpeg poster', job.clipId, err as ExecError);
      note = POSTER_FAILED;
    } finally {
      await rm(out, { force: true });
    }
  }
  await completeClipJob(job, { state: 'done', note, info, poster: made });
}

/** Works through queued media jobs; returns how many it finished. */
export async function runClipJobs(store: ClipStore, max = 10): Promise<number> {
  let done = 0;
  for (; done < max; done++) {
    const job = await claimClipJob();
    if (!job) break;
    await processClipJob(store, job).catch((err: unknown) => retryClipJob(job, err instanceof Error ? err.message : String(err)));
  }
  return done;
}
