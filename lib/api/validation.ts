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
  // Refused before JSON.parse and before any walk, so nothing below ever meets a deep value.
  if (jsonDepth(text) > MAX_JSON_DEPTH) {
    throw invalidInput({ _: `The body is nested more than ${MAX_JSON_DEPTH} levels deep.` }, 'The request body is nested too deeply.');
  }
  let value: unknown;
  try {
    value = JSON.parse(text) as unknown;
  } catch {
    throw new AppError('malformed_json', 'The request body is not valid JSON.');
  }
  const nul = findNul(value);
  if (nul) throw invalidInput({ [nul.join('.') || '_']: 'Text cannot contain NUL characters.' });
  return value;
}

/**
 * The deepest bracket nesting of a JSON text, brackets inside strings not counted. A script body
 * (lib/scripts: 20 node levels, two JSON levels each, plus marks and the wrapper) stays under 50.
 */
export const MAX_JSON_DEPTH = 64;

export function jsonDepth(text: string): number {
  let depth = 0;
  let max = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: the next character is escaped
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) max = Math.max(max, ++depth);
    else if (c === 0x5d || c === 0x7d) depth--;
  }
  return max;
}

// PostgreSQL text cannot hold U+0000 (SQLSTATE 22021), so it is refused here, named by its field.
// An explicit stack rather than recursion: the walk's depth never depends on the body.
export function findNul(root: unknown): string[] | null {
  type Item = { value: unknown; key: string; parent: Item | null };
  const stack: Item[] = [{ value: root, key: '', parent: null }];
  for (let item = stack.pop(); item; item = stack.pop()) {
    const { value } = item;
    if (typeof value === 'string') {
      if (value.includes('\u0000')) return pathOf(item);
    } else if (Array.isArray(value)) {
      for (let i = value.length - 1; i >= 0; i--) stack.push({ value: value[i], key: String(i), parent: item });
    } else if (value && typeof value === 'object') {
      const entries = Object.entries(value);
      for (let i = entries.length - 1; i >= 0; i--) {
        const [key, v] = entries[i] ?? ['', undefined];
        stack.push({ value: v, key, parent: item });
      }
    }
  }
  return null;
}

function pathOf(item: { key: string; parent: { key: string; parent: unknown } | null }): string[] {
  const path: string[] = [];
  for (let at: typeof item | null = item; at?.parent; at = at.parent as typeof item | null) path.push(at.key);
  return path.reverse();
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
