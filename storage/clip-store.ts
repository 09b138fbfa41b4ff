import type { Readable } from 'node:stream';
import type { DataStore } from '@tus/server';
import type { LockMarks } from './upload-lock-queries';

/**
 * What the app needs from wherever clip bytes live: local disk (disk-store.ts) or an S3-compatible
 * bucket (s3-store.ts). Every store keeps the contract in tests/integration/clip-store-contract.test.ts.
 */
export interface ClipStore {
  /** The tus data store behind /api/uploads. */
  readonly tus: DataStore;
  /** Bytes of a stored upload, streamed; `range` is inclusive at both ends, as in HTTP. */
  read(uploadId: string, range?: { start: number; end: number }): Promise<Readable>;
  /** Size and last change of a finished upload's bytes; null when there are none (never stored, removed, unfinished in S3). */
  stat(uploadId: string): Promise<{ size: number; modifiedAt: Date } | null>;
  /** Removes an upload's bytes, finished or not; removing what is already gone is not an error. */
  remove(uploadId: string): Promise<void>;
  /** Unfinished uploads and when their bytes last changed. */
  listUnfinished(): Promise<{ uploadId: string; touchedAt: Date }[]>;
  /** Uploads whose every byte is stored (offset = size), and when their bytes last changed. */
  listFinished(): Promise<{ uploadId: string; touchedAt: Date }[]>;
  /** What ffprobe and ffmpeg open: a local path, or a URL that reads the bytes for `ttlSeconds`. */
  mediaSource(uploadId: string, ttlSeconds?: number): Promise<string>;
  /**
   * The SHA-256 of a finished upload of `size` bytes that the store computed as the bytes went in and
   * checked against what it stored; null when it has none, and the caller reads the bytes back instead.
   */
  verifiedSha256(uploadId: string, size: number): Promise<string | null>;
  /** Forgets what this process cached about an upload. */
  forget(uploadId: string): Promise<void>;
  /**
   * The cross-process upload lock is now held by this process (storage/upload-lock-queries.ts): drop what
   * another process may have changed, which `marks` tell (unchanged since this process's last release: nothing).
   */
  uploadLocked(uploadId: string, marks: LockMarks): Promise<void>;
  /** The lock is about to be released: what this process knows of the upload now carries the lock's mark. */
  uploadUnlocked(uploadId: string): void;
  /** The tus metadata of an upload (who uploads it, to which channel), or null when there is no such upload. */
  uploadMetadata(uploadId: string): Promise<Record<string, string | null> | null>;
  savePoster(clipId: string, jpegPath: string): Promise<void>;
  readPoster(clipId: string): Promise<Readable | null>;
  removePoster(clipId: string): Promise<void>;
  /** Clip ids that have a stored poster, for the orphan sweep. */
  listPosters(): Promise<string[]>;
}

// Upload ids are made by the server (hex); anything else never names a file or an object.
const SAFE_ID = /^[a-f0-9]{32}$/;
const SAFE_CLIP = /^[0-9a-f-]{36}$/;

export function checkUploadId(uploadId: string): string {
  if (!SAFE_ID.test(uploadId)) throw new Error(`not an upload id: ${uploadId}`);
  return uploadId;
}

export function checkClipId(clipId: string): string {
  if (!SAFE_CLIP.test(clipId)) throw new Error(`not a clip id: ${clipId}`);
  return clipId;
}

export const isUploadId = (name: string): boolean => SAFE_ID.test(name);
export const isClipId = (name: string): boolean => SAFE_CLIP.test(name);
