import 'server-only';
import { randomBytes } from 'node:crypto';
import { Server, type Upload } from '@tus/server';
import contentDisposition from 'content-disposition';
import { isAcceptedMediaType } from '@/lib/clips/media-types';
import { displayName } from '@/lib/clips/names';
import type { ClipStore } from './clip-store';
import { maxUploadBytes, posterDirectory, uploadDirectory } from './config';
import { DiskClipStore } from './disk-store';
import { uploadHooks } from './upload-hooks';

export const UPLOAD_PATH = '/api/uploads';

/** A tus server over any ClipStore; the hooks carry the policy. */
export function createTusServer(store: ClipStore): Server {
  const server = new Server({
    path: UPLOAD_PATH,
    datastore: store.tus,
    relativeLocation: true,
    maxSize: maxUploadBytes(),
    // Ids are the server's own; the user's file name never becomes a path.
    namingFunction: () => randomBytes(16).toString('hex'),
    // A finished upload is a clip; it is deleted through the clip route and its policy.
    disableTerminationForFinishedUploads: true,
    ...uploadHooks(store),
  });
  server.handlers.GET.filterContentType = downloadHeaders;
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

// One store and one server per process (kept on globalThis so dev reloads reuse them).
const state = globalThis as unknown as { kerflineClipStore?: ClipStore; kerflineTus?: Server };

export function clipStore(): ClipStore {
  state.kerflineClipStore ??= new DiskClipStore(uploadDirectory(), posterDirectory());
  return state.kerflineClipStore;
}

export function tusServer(): Server {
  state.kerflineTus ??= createTusServer(clipStore());
  return state.kerflineTus;
}
