import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import { crc32 } from 'node:zlib';
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

/** SHA-256 and CRC-32 in one pass: the CRC lets the clip package skip recomputing it (a ZIP record needs it). */
export async function hashesOf(stream: Readable): Promise<{ sha256: string; crc32: number }> {
  const hash = createHash('sha256');
  let crc = 0;
  for await (const chunk of stream) {
    hash.update(chunk as Buffer);
    crc = crc32(chunk as Buffer, crc);
  }
  return { sha256: hash.digest('hex'), crc32: crc };
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
  // The digest the store verified while the bytes came in (then the package computes the CRC-32 as it
  // streams), or else the stored bytes read back once for both: either way the hash of what is stored.
  const verified = await store.verifiedSha256(upload.id, size);
  const { sha256, crc32: crc } = verified ? { sha256: verified, crc32: null } : await hashesOf(await store.read(upload.id));
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
      crc32: crc,
    });
  } catch (err) {
    // The segment was deleted while its clip was still uploading.
    if ((err as { code?: string }).code === '23503') throw tusError(404, 'The segment was deleted during the upload.');
    throw err;
  }
}
