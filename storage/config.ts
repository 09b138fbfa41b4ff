import path from 'node:path';
import { config } from '@/lib/config';

// Values and defaults come from lib/config.ts, validated at start-up; this file turns them into paths and milliseconds.

/** Where clip bytes live; `.data/uploads` under the project unless UPLOAD_DIR says otherwise. */
export const uploadDirectory = (): string => path.resolve(config().UPLOAD_DIR);
export const posterDirectory = (): string => path.resolve(config().POSTER_DIR ?? path.join(uploadDirectory(), '..', 'posters'));
/** The largest clip accepted, 50 GiB unless MAX_UPLOAD_BYTES says otherwise; larger gets 413. */
export const maxUploadBytes = (): number => config().MAX_UPLOAD_BYTES;
/** Unfinished uploads untouched this long are removed with their bytes (7 days by default). */
export const staleUploadMs = (): number => config().STALE_UPLOAD_DAYS * 24 * 3600 * 1000;

export type StorageKind = 'disk' | 's3';

/** STORAGE=s3 puts clips and posters in an S3-compatible bucket; unset (or disk) keeps them on disk. */
export const storageKind = (): StorageKind => config().STORAGE;

export type S3Settings = {
  endpoint: string | undefined;
  bucket: string;
  region: string;
  accessKeyId: string | undefined;
  secretAccessKey: string | undefined;
  forcePathStyle: boolean;
  /** Part size the tus store aims for; large clips get larger parts to stay within maxParts. */
  partSize: number;
  maxParts: number;
};

/**
 * The bucket and how to reach it. Keys unset: the AWS SDK's own chain (environment, instance role).
 * S3_ENDPOINT names a non-AWS server (then path-style URLs unless S3_FORCE_PATH_STYLE=false).
 */
export function s3Settings(): S3Settings {
  const env = config();
  if (!env.S3_BUCKET) throw new Error('STORAGE=s3 needs S3_BUCKET (and usually S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY).');
  return {
    endpoint: env.S3_ENDPOINT,
    bucket: env.S3_BUCKET,
    region: env.S3_REGION,
    accessKeyId: env.S3_ACCESS_KEY_ID,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: env.S3_FORCE_PATH_STYLE ?? env.S3_ENDPOINT !== undefined,
    partSize: env.S3_PART_SIZE_MIB * 1024 * 1024,
    maxParts: env.S3_MAX_PARTS,
  };
}
