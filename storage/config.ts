import path from 'node:path';

const GiB = 1024 ** 3;

const positive = (raw: string | undefined, fallback: number): number => {
  const n = Number(raw);
  return raw !== undefined && Number.isFinite(n) && n > 0 ? n : fallback;
};

/** Where clip bytes live; `.data/uploads` under the project unless UPLOAD_DIR says otherwise. */
export const uploadDirectory = (): string => path.resolve(process.env.UPLOAD_DIR ?? '.data/uploads');
export const posterDirectory = (): string => path.resolve(process.env.POSTER_DIR ?? path.join(uploadDirectory(), '..', 'posters'));
/** The largest clip accepted, 50 GiB unless MAX_UPLOAD_BYTES says otherwise; larger gets 413. */
export const maxUploadBytes = (): number => positive(process.env.MAX_UPLOAD_BYTES, 50 * GiB);
/** Unfinished uploads untouched this long are removed with their bytes (7 days by default). */
export const staleUploadMs = (): number => positive(process.env.STALE_UPLOAD_DAYS, 7) * 24 * 3600 * 1000;

export type StorageKind = 'disk' | 's3';

/** STORAGE=s3 puts clips and posters in an S3-compatible bucket; anything else (or unset) keeps them on disk. */
export const storageKind = (): StorageKind => (process.env.STORAGE === 's3' ? 's3' : 'disk');

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
  const bucket = process.env.S3_BUCKET;
  if (!bucket) throw new Error('STORAGE=s3 needs S3_BUCKET (and usually S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY).');
  const endpoint = process.env.S3_ENDPOINT || undefined;
  return {
    endpoint,
    bucket,
    region: process.env.S3_REGION || 'us-east-1',
    accessKeyId: process.env.S3_ACCESS_KEY_ID || undefined,
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || undefined,
    forcePathStyle: process.env.S3_FORCE_PATH_STYLE ? process.env.S3_FORCE_PATH_STYLE !== 'false' : endpoint !== undefined,
    partSize: positive(process.env.S3_PART_SIZE_MIB, 8) * 1024 * 1024,
    // Source: STACK-NOTES (Swift's s3api takes at most 1000 parts per upload; AWS takes 10,000).
    maxParts: positive(process.env.S3_MAX_PARTS, 1000),
  };
}
