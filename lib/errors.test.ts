import { describe, expect, it } from 'vitest';
import { AppError, conflict, forbidden, invalidInput, notFound, toAppError, toErrorBody, unauthenticated } from './errors';

describe('error mapping', () => {
  it.each([
    [invalidInput({ email: 'x' }), 400, 'invalid_input'],
    [unauthenticated(), 401, 'unauthenticated'],
    [forbidden(), 403, 'forbidden'],
    [notFound('That channel'), 404, 'not_found'],
    [conflict('taken'), 409, 'conflict'],
    [new AppError('payload_too_large', 'big'), 413, 'payload_too_large'],
    [new AppError('unsupported_media_type', 'type'), 415, 'unsupported_media_type'],
    [new AppError('unprocessable', 'no'), 422, 'unprocessable'],
    [new AppError('too_many_requests', 'slow'), 429, 'too_many_requests'],
  ])('%s -> %i', (err, status, code) => {
    expect(err.status).toBe(status);
    expect(toErrorBody(err).error.code).toBe(code);
  });

  it('keeps field errors in the body only when there are some', () => {
    expect(toErrorBody(invalidInput({ email: 'Enter an e-mail.' }))).toEqual({
      error: { code: 'invalid_input', message: 'Some fields need attention.', fields: { email: 'Enter an e-mail.' } },
    });
    expect(toErrorBody(notFound())).toEqual({ error: { code: 'not_found', message: 'That was not found.' } });
  });

  // SQLSTATE codes from the PostgreSQL manual, Appendix A "PostgreSQL Error Codes".
  it.each([
    ['23505', 409],
    ['23503', 409],
    ['22P02', 400],
    ['22001', 400],
  ])('maps PostgreSQL %s to %i', (code, status) => {
    expect(toAppError({ code }).status).toBe(status);
  });

  it('turns anything else into a generic 500 that keeps the cause for the log, not the message', () => {
    const cause = new Error('connection refused at 10.0.0.1');
    const err = toAppError(cause);
    expect(err.status).toBe(500);
    expect(err.message).not.toContain('10.0.0.1');
    expect(err.cause).toBe(cause);
  });
});
