// One error family for the whole app; lib/api maps it to HTTP. Messages are safe to show to users.
export type ErrorCode =
  | 'bad_request'
  | 'invalid_input'
  | 'malformed_json'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'unprocessable'
  | 'too_many_requests'
  | 'internal';

export type FieldErrors = Record<string, string>;

const statusByCode: Record<ErrorCode, number> = {
  bad_request: 400,
  invalid_input: 400,
  malformed_json: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  too_many_requests: 429,
  internal: 500,
};

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields: FieldErrors | undefined;
  /** For too_many_requests: the Retry-After the answer carries. */
  readonly retryAfterSeconds: number | undefined;

  constructor(code: ErrorCode, message: string, fields?: FieldErrors, options?: { cause?: unknown; retryAfterSeconds?: number }) {
    super(message, options);
    this.name = 'AppError';
    this.code = code;
    this.fields = fields;
    this.retryAfterSeconds = options?.retryAfterSeconds;
  }

  get status(): number {
    return statusByCode[this.code];
  }
}

export const invalidInput = (fields: FieldErrors, message = 'Some fields need attention.') =>
  new AppError('invalid_input', message, fields);
export const unauthenticated = () => new AppError('unauthenticated', 'Sign in to continue.');
export const forbidden = (message = 'Your role on this channel does not allow that.') =>
  new AppError('forbidden', message);
export const notFound = (what = 'That') => new AppError('not_found', `${what} was not found.`);
export const conflict = (message: string, fields?: FieldErrors) => new AppError('conflict', message, fields);
export const tooManyRequests = (message: string, retryAfterSeconds: number) =>
  new AppError('too_many_requests', message, undefined, { retryAfterSeconds: Math.max(1, Math.ceil(retryAfterSeconds)) });

export type ErrorBody = { error: { code: ErrorCode; message: string; fields?: FieldErrors } };

type PgError = { code?: unknown; constraint?: unknown };

// CHECK constraints whose rule a person can act on: the field and message the route would have given.
const checkMessages: Record<string, FieldErrors> = {
  episodes_shoot_not_after_publish: { publishDate: 'The publish date comes after the shoot date.' },
};

// PostgreSQL SQLSTATEs that come from bad input rather than a bug (see the PostgreSQL manual, appendix A).
function fromPgError(err: PgError): AppError | null {
  const named = err.code === '23514' && typeof err.constraint === 'string' ? checkMessages[err.constraint] : undefined;
  if (named) return invalidInput(named);
  switch (err.code) {
    case '23505':
      return new AppError('conflict', 'That already exists.');
    case '23503':
      return new AppError('conflict', 'That refers to something that no longer exists.');
    case '23514':
      return new AppError('bad_request', 'A value is outside what is allowed.');
    case '22P02':
    case '22001':
    case '22003':
    case '22007':
    case '22008':
    case '22021':
      return new AppError('bad_request', 'A value is not in the expected form.');
    default:
      return null;
  }
}

export function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (typeof err === 'object' && err !== null) {
    const mapped = fromPgError(err as PgError);
    if (mapped) return mapped;
  }
  return new AppError('internal', 'Something went wrong on our side. Nothing was changed; please try again.', undefined, {
    cause: err,
  });
}

export function toErrorBody(err: AppError): ErrorBody {
  return { error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } };
}
