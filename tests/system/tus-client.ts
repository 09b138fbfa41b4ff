import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import { Upload } from 'tus-js-client';

/** A file of random bytes written in 8 MiB pieces, and its SHA-256. */
export async function makeRandomFile(file: string, bytes: number): Promise<string> {
  const hash = createHash('sha256');
  const out = fs.createWriteStream(file);
  for (let left = bytes; left > 0; ) {
    const piece = randomBytes(Math.min(left, 8 * 1024 * 1024));
    hash.update(piece);
    if (!out.write(piece)) await new Promise<void>((r) => out.once('drain', () => r()));
    left -= piece.length;
  }
  await new Promise<void>((resolve, reject) => out.end((err?: Error | null) => (err ? reject(err) : resolve())));
  return hash.digest('hex');
}

export type TusRun = { url: string | null; done: Promise<void>; abort: () => Promise<void> };

/** tus-js-client in Node, as the browser uses it: 8 MiB chunks, retries with back-off, one request at a time. */
export function startTusUpload(
  endpoint: string,
  file: string,
  opts: { cookie: string; metadata: Record<string, string>; uploadUrl?: string; onProgress?: (sent: number, total: number) => void; retryDelays?: number[] },
): TusRun {
  const run: TusRun = { url: opts.uploadUrl ?? null, done: Promise.resolve(), abort: async () => {} };
  run.done = new Promise<void>((resolve, reject) => {
    const upload = new Upload(fs.createReadStream(file), {
      endpoint,
      uploadUrl: opts.uploadUrl,
      chunkSize: 8 * 1024 * 1024,
      uploadSize: fs.statSync(file).size,
      // A browser sends Origin on every tus POST, PATCH and DELETE; the server refuses them without it.
      headers: { cookie: opts.cookie, origin: new URL(endpoint).origin },
      metadata: opts.metadata,
      retryDelays: opts.retryDelays ?? [250, 500, 1000, 2000, 2000, 4000, 4000, 4000, 8000],
      onUploadUrlAvailable: () => {
        run.url = upload.url;
      },
      onProgress: opts.onProgress,
      onError: reject,
      onSuccess: () => resolve(),
    });
    run.abort = () => upload.abort();
    upload.start();
  });
  return run;
}
