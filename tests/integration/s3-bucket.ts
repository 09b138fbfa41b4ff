import { randomBytes } from 'node:crypto';
import { CreateBucketCommand } from '@aws-sdk/client-s3';
import type { S3Settings } from '@/storage/config';
import { makeS3Client } from '@/storage/s3-client';

/**
 * The S3-compatible server `npm test` starts (Debian's Swift with s3api, scripts/lib/swift.mjs) hands its
 * address and keys to Vitest as S3_* variables. Each suite takes a fresh bucket so suites running side by
 * side never see each other's uploads.
 */
export function s3TestSettings(bucket?: string): S3Settings {
  const { S3_ENDPOINT, S3_BUCKET, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY } = process.env;
  if (!S3_ENDPOINT || !S3_BUCKET || !S3_ACCESS_KEY_ID || !S3_SECRET_ACCESS_KEY) {
    throw new Error('The S3 tests need the Swift server `npm test` starts (S3_ENDPOINT, S3_BUCKET, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY).');
  }
  return {
    endpoint: S3_ENDPOINT,
    bucket: bucket ?? S3_BUCKET,
    region: process.env.S3_REGION ?? 'us-east-1',
    accessKeyId: S3_ACCESS_KEY_ID,
    secretAccessKey: S3_SECRET_ACCESS_KEY,
    forcePathStyle: true,
    partSize: 8 * 1024 * 1024,
    maxParts: 1000,
  };
}

export async function newTestBucket(label: string): Promise<S3Settings> {
  const settings = s3TestSettings(`kerfline-${label}-${randomBytes(4).toString('hex')}`);
  const client = makeS3Client(settings);
  await client.send(new CreateBucketCommand({ Bucket: settings.bucket }));
  client.destroy();
  return settings;
}

/** The environment an app process needs to keep its clips in `settings.bucket`. */
export const s3AppEnv = (s: S3Settings): Record<string, string> => ({
  STORAGE: 's3',
  S3_ENDPOINT: s.endpoint ?? '',
  S3_BUCKET: s.bucket,
  S3_REGION: s.region,
  S3_ACCESS_KEY_ID: s.accessKeyId ?? '',
  S3_SECRET_ACCESS_KEY: s.secretAccessKey ?? '',
});
