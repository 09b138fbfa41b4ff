/** The shape @tus/server turns into a response: a status and a plain-text body, as the tus protocol sends errors. */
export type TusError = { status_code: number; body: string };

export const tusError = (status_code: number, message: string): TusError => ({ status_code, body: `${message}\n` });

export const isTusError = (v: unknown): v is TusError =>
  typeof v === 'object' && v !== null && typeof (v as TusError).status_code === 'number' && typeof (v as TusError).body === 'string';
