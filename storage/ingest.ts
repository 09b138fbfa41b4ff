import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Upload } from '@tus/server';
import { findClipIdByUpload, recordClipOnce } from '@/lib/clips/queries';
import type { ClipStore } from './clip-store';
import { tusError } from './tus-errors';

/** SHA-256 of a stream, chunk by chunk: a 50 GiB clip never sits in memory. */
export async function sha256Of(stream: Readable): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of stream) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

/** Turns a finished upload into its clip row (once) and queues the media job. */
export async function ingestUpload(store: ClipStore, upload: Upload): Promise<{ clipId: string; created: boolean }> {
  const meta = upload.metadata ?? {};
  const { segmentId, shotId, filename, filetype, uploaderId } = meta;
  if (!segmentId || !filename || !filetype || !uploaderId) throw tusError(400, 'This upload has no clip details; start it again.');
  // A retried finish finds its row and does not hash the bytes again.
  const existing = await findClipIdByUpload(upload.id);
  if (existing) return { clipId: existing, created: false };
  const size = upload.size ?? upload.offset;
  // The digest the store verified while the bytes came in, or else the stored bytes read back: either way the hash of what is stored.
  const sha256 = (await store.verifiedSha256(upload.id, size)) ?? (await sha256Of(await store.read(upload.id)));
  try {
    return await recordClipOnce({
      uploadId: upload.id,
      segmentId,
      shotId: shotId ?? null,
      uploadedBy: uploaderId,
      originalName: filename,
      mimeType: filetype,
      sizeBytes: size,
      sha256,
    });
  } catch (err) {
    // The segment was deleted while its clip was still uploading.
    if ((err as { code?: string }).code === '23503') throw tusError(404, 'The segment was deleted during the upload.');
    throw err;
  }
}
