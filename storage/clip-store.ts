import type { Readable } from 'node:stream';
import type { DataStore } from '@tus/server';

/**
 * What the app needs from wherever clip bytes live. The disk store implements it today; an
 * S3-compatible store (@tus/s3-store for `tus`, GetObject with Range for `read`) is the next one.
 */
export interface ClipStore {
  /** The tus data store behind /api/uploads. */
  readonly tus: DataStore;
  /** Bytes of a stored upload; `range` is inclusive at both ends, as in HTTP. */
  read(uploadId: string, range?: { start: number; end: number }): Promise<Readable>;
  remove(uploadId: string): Promise<void>;
  /** Unfinished uploads and when their bytes last changed. */
  listUnfinished(): Promise<{ uploadId: string; touchedAt: Date }[]>;
  /** Uploads whose every byte is stored (offset = size), and when their bytes last changed. */
  listFinished(): Promise<{ uploadId: string; touchedAt: Date }[]>;
  /** A path ffprobe and ffmpeg can open, or null when the bytes are not on this machine. */
  localPath(uploadId: string): string | null;
  savePoster(clipId: string, jpegPath: string): Promise<void>;
  readPoster(clipId: string): Promise<Readable | null>;
  removePoster(clipId: string): Promise<void>;
  /** Clip ids that have a stored poster, for the orphan sweep. */
  listPosters(): Promise<string[]>;
}
