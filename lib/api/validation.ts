import type { z } from 'zod';
import { AppError, invalidInput, type FieldErrors } from '@/lib/errors';

export const DEFAULT_MAX_BODY_BYTES = 64 * 1024;

export function fieldErrorsFrom(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[[...issue.path.map(String), k].join('.')] ??= 'This field is not accepted.';
      continue;
    }
    fields[key] ??= issue.message;
  }
  return fields;
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown, message?: string): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw invalidInput(fieldErrorsFrom(result.error), message);
  return result.data;
}

/** Reads a JSON body with a size cap; wrong type 415, too big 413, not JSON 400. */
export async function readJsonBody(req: Request, maxBytes = DEFAULT_MAX_BODY_BYTES): Promise<unknown> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^application\/(?:[\w.+-]+\+)?json\b/i.test(type)) {
    throw new AppError('unsupported_media_type', 'Send the body as JSON (Content-Type: application/json).');
  }
  const declared = Number(req.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw tooLarge(maxBytes);
  const bytes = await readCapped(req, maxBytes);
  const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  if (text.trim() === '') throw new AppError('malformed_json', 'The request body is empty; send a JSON object.');
  let value: unknown;
  try {
    value = JSON.parse(text) as unknown;
  } catch {
    throw new AppError('malformed_json', 'The request body is not valid JSON.');
  }
  const nul = findNul(value, []);
  if (nul) throw invalidInput({ [nul.join('.') || '_']: 'Text cannot contain NUL characters.' });
  return value;
}

// PostgreSQL text cannot hold U+0000 (SQLSTATE 22021), so it is refused here, named by its field.
function findNul(value: unknown, path: string[]): string[] | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const hit = findNul(value[i], [...path, String(i)]);
      if (hit) return hit;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const hit = findNul(v, [...path, k]);
      if (hit) return hit;
    }
  }
  return null;
}

const tooLarge = (maxBytes: number) =>
  new AppError('payload_too_large', `The request body is larger than ${Math.round(maxBytes / 1024)} KB.`);

async function readCapped(req: Request, maxBytes: number): Promise<Uint8Array> {
  if (!req.body) return new Uint8Array();
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    out.set(c, offset);
    offset += c.byteLength;
  }
  return out;
}

export function searchParamsObject(url: URL): Record<string, string> {
  return Object.fromEntries(url.searchParams.entries());
}
