import 'server-only';
import { randomBytes } from 'node:crypto';
import { Server } from '@tus/server';
import pg from 'pg';
import type { ClipStore } from './clip-store';
import { maxUploadBytes, posterDirectory, s3Settings, storageKind, uploadDirectory } from './config';
import { DiskClipStore } from './disk-store';
import { PgLocker } from './pg-locker';
import { S3ClipStore } from './s3-store';
import { uploadHooks } from './upload-hooks';

export const UPLOAD_PATH = '/api/uploads';

/** A tus server over any ClipStore; the hooks carry the policy, the locker keeps one writer per upload across processes. */
export function createTusServer(store: ClipStore, lockPool: pg.Pool): Server {
  return new Server({
    path: UPLOAD_PATH,
    datastore: store.tus,
    locker: new PgLocker(lockPool, { onAcquired: (id) => store.forget(id) }),
    relativeLocation: true,
    maxSize: maxUploadBytes(),
    // Ids are the server's own; the user's file name never becomes a path.
    namingFunction: () => randomBytes(16).toString('hex'),
    // A finished upload is a clip; it is deleted through the clip route and its policy.
    disableTerminationForFinishedUploads: true,
    ...uploadHooks(store),
  });
}

/** The store the configuration names: STORAGE=s3 (with S3_* settings) or the disk under UPLOAD_DIR. */
export function createClipStore(): ClipStore {
  return storageKind() === 's3' ? new S3ClipStore(s3Settings()) : new DiskClipStore(uploadDirectory(), posterDirectory());
}

// One store, lock pool and server per process (kept on globalThis so dev reloads reuse them).
const state = globalThis as unknown as { kerflineClipStore?: ClipStore; kerflineTus?: Server; kerflineLockPool?: pg.Pool };

export function clipStore(): ClipStore {
  state.kerflineClipStore ??= createClipStore();
  return state.kerflineClipStore;
}

/** Each tus request in flight holds one of these connections while it has its upload locked. */
function lockPool(): pg.Pool {
  state.kerflineLockPool ??= new pg.Pool({
    connectionString: process.env.DATABASE_URL,
    max: Number(process.env.UPLOAD_LOCK_POOL_MAX ?? 20),
    idleTimeoutMillis: 30_000,
  });
  return state.kerflineLockPool;
}

export function tusServer(): Server {
  state.kerflineTus ??= createTusServer(clipStore(), lockPool());
  return state.kerflineTus;
}
