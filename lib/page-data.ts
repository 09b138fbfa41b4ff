import 'server-only';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/errors';

/** Pages show Next's 404 for what queries report as not found (another channel's episode, a deleted segment). */
export async function orNotFound<T>(load: Promise<T>): Promise<T> {
  try {
    return await load;
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound();
    throw err;
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A malformed id in a page URL names nothing: 404 before any query runs. */
export function uuidOr404(value: string): string {
  if (!UUID.test(value)) notFound();
  return value;
}
