import type { DetailedError as TusDetailedError, PreviousUpload } from 'tus-js-client';
import { UPLOAD_CHUNK_BYTES } from '@/lib/clips/upload-chunk';
import type { UploadTarget, UploadTransport } from '@/lib/clips/upload-queue';

// tus-js-client as the upload queue's transport. Source: tus 1.0.0 protocol; tus-js-client 4 API.

const RETRY_DELAYS = [0, 1000, 3000, 5000, 10000, 20000, 30000];

const statusOf = (err: TusDetailedError | Error) => ('originalResponse' in err ? (err.originalResponse?.getStatus() ?? 0) : 0);

function messageOf(err: unknown): string {
  if (!(err instanceof Error)) return 'The upload stopped for an unknown reason.';
  if (!('originalRequest' in err)) return err.message;
  const res = (err as TusDetailedError).originalResponse;
  const status = res?.getStatus() ?? 0;
  if (!res || status === 0) return 'Could not reach Kerfline. Check the connection, then press Resume.';
  const body = res.getBody()?.trim() ?? '';
  // The server's tus errors are one line of plain text; anything else (a proxy's HTML page) is not for reading.
  if (body && !body.startsWith('<')) return body.slice(0, 300);
  if (status === 413) return 'The file is larger than this server accepts.';
  return `The server refused the upload (${status}).`;
}

async function serverOffset(url: string): Promise<number | null> {
  try {
    const res = await fetch(url, { method: 'HEAD', headers: { 'Tus-Resumable': '1.0.0' }, credentials: 'same-origin', cache: 'no-store' });
    const offset = Number(res.headers.get('Upload-Offset'));
    return res.ok && Number.isFinite(offset) ? offset : null;
  } catch {
    return null;
  }
}

/** The newest unfinished upload of this file for the same segment and shot, not one meant for another place. */
function previousFor(previous: PreviousUpload[], t: UploadTarget): PreviousUpload | undefined {
  return previous
    .filter((p) => p.uploadUrl && p.metadata.segmentId === t.segmentId && (p.metadata.shotId ?? null) === t.shotId)
    .sort((a, b) => b.creationTime.localeCompare(a.creationTime))[0];
}

export const tusTransport: UploadTransport<File> = {
  async create(file, target, events) {
    // Loaded here so the server never evaluates it: it belongs to the browser.
    const tus = await import('tus-js-client');
    const { segmentId, shotId } = target;
    const upload = new tus.Upload(file, {
      endpoint: new URL('/api/uploads', location.origin).href,
      chunkSize: UPLOAD_CHUNK_BYTES,
      retryDelays: RETRY_DELAYS,
      // The disk store cannot concatenate partial uploads.
      parallelUploads: 1,
      metadata: { segmentId, ...(shotId ? { shotId } : {}), filename: file.name, filetype: file.type || 'application/octet-stream' },
      storeFingerprintForResuming: true,
      removeFingerprintOnSuccess: true,
      onProgress: (sent, total) => events.progress(sent, total),
      onShouldRetry: (err) => events.shouldRetry(statusOf(err)),
      onError: (err) => events.failed(messageOf(err), statusOf(err)),
      onSuccess: () => events.succeeded(),
    });
    return {
      async resumePrevious() {
        const previous = previousFor(await upload.findPreviousUploads(), target);
        if (!previous?.uploadUrl) return null;
        const offset = await serverOffset(previous.uploadUrl);
        upload.resumeFromPreviousUpload(previous);
        return offset;
      },
      start: () => upload.start(),
      abort: (terminate) => upload.abort(terminate),
    };
  },
};
