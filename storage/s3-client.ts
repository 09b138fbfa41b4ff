import { createHash } from 'node:crypto';
import { S3Client, type S3ClientConfig } from '@aws-sdk/client-s3';
import type { S3Settings } from './config';

/** The AWS SDK settings for any S3-compatible server, Swift's s3api included. */
export function s3ClientConfig(s: S3Settings): S3ClientConfig {
  return {
    region: s.region,
    endpoint: s.endpoint,
    forcePathStyle: s.forcePathStyle,
    ...(s.accessKeyId && s.secretAccessKey ? { credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey } } : {}),
    // Source: STACK-NOTES (Swift refuses the aws-chunked bodies newer SDKs send for checksums by default).
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  };
}

type Stack = S3Client['middlewareStack'];

/**
 * Multi-object delete must carry Content-MD5 (Source: AWS S3 API reference, DeleteObjects; Swift's s3api
 * enforces it). Newer SDKs send only a CRC32 checksum, so the MD5 is added before signing.
 */
export function addDeleteObjectsMd5(stack: Stack): void {
  stack.add(
    (next, context) => async (args) => {
      const request = args.request as { headers?: Record<string, string>; body?: unknown };
      if (context.commandName === 'DeleteObjectsCommand' && request.headers && (typeof request.body === 'string' || request.body instanceof Uint8Array)) {
        request.headers['content-md5'] = createHash('md5').update(request.body).digest('base64');
      }
      return next(args);
    },
    { step: 'build', name: 'kerflineDeleteObjectsMd5', override: true },
  );
}

/**
 * Part uploads say their payload is unsigned instead of the SDK hashing every in-memory part once more
 * for the signature (a stream body is sent unsigned anyway). Their integrity is checked where it matters:
 * each part's ETag must be the MD5 the upload hashed (upload-digest.ts), or the clip is read back.
 * Source: Amazon S3 API Reference, "Authenticating Requests (AWS Signature Version 4)": x-amz-content-sha256
 * may be UNSIGNED-PAYLOAD; @smithy/signature-v4 signs with a value already in that header.
 */
export function addUnsignedPartPayload(stack: Stack): void {
  stack.add(
    (next, context) => async (args) => {
      const request = args.request as { headers?: Record<string, string> };
      if (context.commandName === 'UploadPartCommand' && request.headers) request.headers['x-amz-content-sha256'] = 'UNSIGNED-PAYLOAD';
      return next(args);
    },
    { step: 'build', name: 'kerflineUnsignedPartPayload', override: true },
  );
}

export function makeS3Client(s: S3Settings): S3Client {
  const client = new S3Client(s3ClientConfig(s));
  addDeleteObjectsMd5(client.middlewareStack);
  return client;
}
