import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AppError } from '@/lib/errors';
import { MAX_JSON_DEPTH, fieldErrorsFrom, findNul, jsonDepth, parseWith, readJsonBody } from './validation';

const req = (body: string, type = 'application/json') =>
  new Request('http://127.0.0.1/x', { method: 'POST', body, headers: type ? { 'content-type': type } : {} });

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'ok';
  } catch (err) {
    return err instanceof AppError ? err.code : 'other';
  }
}

describe('readJsonBody', () => {
  it('parses JSON, including +json media types', async () => {
    expect(await readJsonBody(req('{"a":1}'))).toEqual({ a: 1 });
    expect(await readJsonBody(req('[1]', 'application/merge-patch+json'))).toEqual([1]);
  });
  it('refuses other media types with 415', async () => {
    expect(await codeOf(readJsonBody(req('a=1', 'application/x-www-form-urlencoded')))).toBe('unsupported_media_type');
    expect(await codeOf(readJsonBody(req('{}', '')))).toBe('unsupported_media_type');
  });
  it('refuses broken or empty JSON with 400', async () => {
    expect(await codeOf(readJsonBody(req('{"a":')))).toBe('malformed_json');
    expect(await codeOf(readJsonBody(req('   ')))).toBe('malformed_json');
  });
  it('refuses a NUL character in any string, naming the field, since PostgreSQL text cannot store it', async () => {
    const err = await readJsonBody(req(JSON.stringify({ shots: [{ description: 'a\u0000b' }] }))).catch((e: unknown) => e);
    expect(err).toMatchObject({ code: 'invalid_input', fields: { 'shots.0.description': 'Text cannot contain NUL characters.' } });
  });
  it('refuses bodies over the cap with 413 while reading', async () => {
    expect(await codeOf(readJsonBody(req(JSON.stringify({ a: 'x'.repeat(2000) })), 1000))).toBe('payload_too_large');
  });
});

describe('deeply nested bodies (issue 12, item 3)', () => {
  it('answers 400 naming the body, not a stack overflow, for 6,000 levels of arrays or objects', async () => {
    const arrays = '['.repeat(6000) + ']'.repeat(6000);
    const objects = '{"a":'.repeat(6000) + '1' + '}'.repeat(6000);
    for (const body of [arrays, objects]) {
      const err = await readJsonBody(req(body)).catch((e: unknown) => e);
      expect(err).toMatchObject({ code: 'invalid_input', fields: { _: expect.stringContaining(String(MAX_JSON_DEPTH)) } });
    }
  });
  it('accepts nesting up to the limit and counts no brackets inside strings', async () => {
    const atLimit = '['.repeat(MAX_JSON_DEPTH) + ']'.repeat(MAX_JSON_DEPTH);
    expect(await codeOf(readJsonBody(req(atLimit)))).toBe('ok');
    expect(jsonDepth(JSON.stringify({ a: '[[[{{{"\\', b: ['x'] }))).toBe(2);
  });
  it('walks a value of any depth for NUL without recursion', () => {
    let deep: unknown = 'a\u0000';
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expect(findNul(deep)?.length).toBe(200_000);
    expect(findNul({ a: [1, { b: 'ok' }], c: 'x\u0000' })).toEqual(['c']);
  });
});

describe('field errors', () => {
  const schema = z.strictObject({ email: z.email('Bad e-mail.'), nested: z.object({ n: z.number('A number.') }) });
  it('names each bad field by its path and each unknown field', () => {
    const result = schema.safeParse({ email: 'x', nested: { n: 'y' }, extra: 1 });
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(fieldErrorsFrom(result.error)).toEqual({ email: 'Bad e-mail.', 'nested.n': 'A number.', extra: 'This field is not accepted.' });
  });
  it('parseWith throws invalid_input with those fields', () => {
    try {
      parseWith(schema, {});
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).fields).toHaveProperty('email');
    }
  });
});
