import 'server-only';
import { randomBytes } from 'node:crypto';
import { Server } from '@tus/server';
import type { ClipStore } from './clip-store';
import { maxUploadBytes, posterDirectory, uploadDirectory } from './config';
import { DiskClipStore } from './disk-store';
import { uploadHooks } from './upload-hooks';

export const UPLOAD_PATH = '/api/uploads';

/** A tus server over any ClipStore; the hooks carry the policy. */
export function createTusServer(store: ClipStore): Server {
  return new Server({
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
