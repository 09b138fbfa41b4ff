import { AsyncLocalStorage } from 'node:async_hooks';

// The Content-Length of the tus PATCH being handled, for the store's write (which @tus/server hands only
// the body stream): knowing where the body ends lets the S3 store stream each part as it arrives
// (part-streamer.ts). Request-scoped, so concurrent PATCHes never see each other's length.
const declared = new AsyncLocalStorage<number>();

/** Runs `handle` with the request's declared body length available to `declaredBodyLength()`; none when the header is absent or not a plain number. */
export function withDeclaredBodyLength<T>(req: Pick<Request, 'headers'>, handle: () => T): T {
  const raw = req.headers.get('content-length');
  // Source: RFC 9110 §8.6, Content-Length = 1*DIGIT.
  const length = raw !== null && /^\d{1,15}$/.test(raw) ? Number(raw) : null;
  return length === null ? handle() : declared.run(length, handle);
}

/** The body length the current PATCH declared, or undefined (chunked transfer, or not inside a PATCH). */
export const declaredBodyLength = (): number | undefined => declared.getStore();
