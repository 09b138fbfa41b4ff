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
