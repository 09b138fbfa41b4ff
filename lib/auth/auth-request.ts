import { NextRequest } from 'next/server';
import { errorResponse } from '@/lib/api/handler';
import { AppError } from '@/lib/errors';

/**
 * next-auth v4 reads a JSON body with `await req.json()` and lets a parse error escape as a 500.
 * Here a JSON body is read first: not JSON, or JSON that is not an object, is a 400 in the app's
 * error shape; a good one is handed on in a fresh request (the original's body is spent).
 */
export async function checkedAuthRequest(req: NextRequest): Promise<NextRequest | Response> {
  if (req.method !== 'POST' || !/application\/json/i.test(req.headers.get('content-type') ?? '')) return req;
  const text = await req.text();
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return errorResponse(new AppError('malformed_json', 'The request body is not valid JSON.'), req);
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    return errorResponse(new AppError('malformed_json', 'Send the body as a JSON object.'), req);
  }
  return new NextRequest(req.url, { method: req.method, headers: req.headers, body: text });
}
