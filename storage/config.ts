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
