import 'server-only';
import { randomBytes } from 'node:crypto';
import { Server, type Upload } from '@tus/server';
import { lockPool } from '@/db/lock-pool';
import contentDisposition from 'content-disposition';
import { isAcceptedMediaType } from '@/lib/clips/media-types';
import { displayName } from '@/lib/clips/names';
import type { ClipStore } from './clip-store';
import { maxUploadBytes, posterDirectory, s3Settings, storageKind, uploadDirectory } from './config';
import { DiskClipStore } from './disk-store';
import { withDeclaredBodyLength } from './patch-length';
import { PgLocker, type LockPool } from './upload-lock-queries';
import { S3ClipStore } from './s3-store';
import { uploadHooks } from './upload-hooks';

export const UPLOAD_PATH = '/api/uploads';

/** A tus server over any ClipStore; the hooks carry the policy, the locker keeps one writer per upload across processes. */
export function createTusServer(store: ClipStore, lockPool: LockPool): Server {
  const server = new Server({
    path: UPLOAD_PATH,
    datastore: store.tus,
    locker: new PgLocker(lockPool, { onAcquired: (id, marks) => store.uploadLocked(id, marks), onReleasing: (id) => store.uploadUnlocked(id) }),
    relativeLocation: true,
    maxSize: maxUploadBytes(),
    // Ids are the server's own; the user's file name never becomes a path.
    namingFunction: () => randomBytes(16).toString('hex'),
    // A finished upload is a clip; it is deleted through the clip route and its policy.
    disableTerminationForFinishedUploads: true,
    ...uploadHooks(store),
  });
  server.handlers.GET.filterContentType = downloadHeaders;
  const patch = server.handlers.PATCH;
  const send = patch.send.bind(patch);
  patch.send = (req, context, headers) => withDeclaredBodyLength(req, () => send(req, context, headers));
  return server;
}

/**
 * Headers for a tus GET (reading back a finished upload). @tus/server quotes the raw file name
 * into Content-Disposition, and a name outside Latin-1 cannot be a header value (a ByteString),
 * so such a GET answered 500. Here the name is encoded per RFC 6266 with an RFC 8187 filename*,
 * the type is the allow-listed one or opaque bytes, and the answer is always a download.
 */
export function downloadHeaders(upload: Upload): { contentType: string; contentDisposition: string } {
  const { filetype, filename } = upload.metadata ?? {};
  return {
    contentType: filetype && isAcceptedMediaType(filetype) ? filetype.toLowerCase() : 'application/octet-stream',
    contentDisposition: contentDisposition(displayName(filename ?? ''), { type: 'attachment' }),
  };
}

/** The store the configuration names: STORAGE=s3 (with S3_* settings) or the disk under UPLOAD_DIR. */
export function createClipStore(): ClipStore {
  return storageKind() === 's3' ? new S3ClipStore(s3Settings()) : new DiskClipStore(uploadDirectory(), posterDirectory());
}

// One store and server per process (kept on globalThis so dev reloads reuse them).
const state = globalThis as unknown as { kerflineClipStore?: ClipStore; kerflineTus?: Server };

export function clipStore(): ClipStore {
  state.kerflineClipStore ??= createClipStore();
  return state.kerflineClipStore;
}

export function tusServer(): Server {
  state.kerflineTus ??= createTusServer(clipStore(), lockPool());
  return state.kerflineTus;
}
