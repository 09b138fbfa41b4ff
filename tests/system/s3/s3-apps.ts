import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import { db } from '@/db/client';
import { sha256Of } from '@/storage/ingest';
import { S3ClipStore } from '@/storage/s3-store';
import { AppServer } from '../app-server';
import { s3AppEnv, s3TestSettings } from '../../integration/s3-bucket';

// Every app these suites start keeps clips in the one test bucket: any of them may run any clip's media job.
export const settings = () => s3TestSettings();
export const bucketStore = () => new S3ClipStore(settings());

const uploadTestPort = Number(process.env.UPLOAD_TEST_PORT ?? 3197);
/** Ports next to the disk upload test's, each overridable: SCALE_TEST_PORT_A, SCALE_TEST_PORT_B, UPLOAD_S3_TEST_PORT. */
export const ports = {
  a: Number(process.env.SCALE_TEST_PORT_A ?? uploadTestPort + 1),
  b: Number(process.env.SCALE_TEST_PORT_B ?? uploadTestPort + 2),
  uploads: Number(process.env.UPLOAD_S3_TEST_PORT ?? uploadTestPort + 3),
};

/** The built app on `port`, on S3, with the same database, secret and mail relay as every other process. */
export function s3App(port: number, extra: Record<string, string> = {}): AppServer {
  return new AppServer(port, {
    DATABASE_URL: process.env.DATABASE_URL ?? '',
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? '',
    NEXTAUTH_URL: `http://127.0.0.1:${port}`,
    ...s3AppEnv(settings()),
    MAX_UPLOAD_BYTES: String(300 * 1024 * 1024),
    CLIP_JOB_POLL_MS: '250',
    ...extra,
  });
}

/** A real video ffprobe and ffmpeg can read, about 1.7 MB per second of `seconds` (Motion JPEG, so it is quick to make). */
export function makeVideo(file: string, seconds: number): { sha: string; size: number } {
  execFileSync('ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc2=size=1280x720:rate=25', '-t', String(seconds), '-c:v', 'mjpeg', '-q:v', '2', '-pix_fmt', 'yuvj420p', file]);
  const bytes = fs.readFileSync(file);
  return { sha: createHash('sha256').update(bytes).digest('hex'), size: bytes.length };
}

export const storedSha = async (uploadId: string) => sha256Of(await bucketStore().read(uploadId));

export const clipsOf = (uploadId: string) => db('clips').where({ upload_id: uploadId });
export const idOf = (url: string) => url.split('/').pop() ?? '';

/**
 * A tus PATCH whose body trickles out in `pieces` with a pause between them, through node:http so the
 * answer is read even when the server answers before taking the whole body (a 409 after waiting).
 */
export function slowPatch(url: string, cookie: string, offset: number, body: Buffer, pieces = 12, pauseMs = 120): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, {
      method: 'PATCH',
      headers: {
        'Tus-Resumable': '1.0.0',
        'Upload-Offset': String(offset),
        'Content-Type': 'application/offset+octet-stream',
        'Content-Length': String(body.length),
        cookie,
        origin: new URL(url).origin,
      },
    });
    let answered = false;
    req.on('response', (res) => {
      answered = true;
      res.resume();
      res.on('end', () => resolve(res.statusCode ?? 0));
    });
    // The server may close the connection on a body it no longer wants; the status already came.
    req.on('error', (err) => {
      if (!answered) reject(err);
    });
    void (async () => {
      const step = Math.ceil(body.length / pieces);
      for (let at = 0; at < body.length && !answered; at += step) {
        if (!req.write(body.subarray(at, at + step))) await new Promise<void>((r) => req.once('drain', () => r()));
        await new Promise((r) => setTimeout(r, pauseMs));
      }
      req.end();
    })().catch(() => {});
  });
}
