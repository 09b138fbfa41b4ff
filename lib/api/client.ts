import type { ErrorBody, FieldErrors } from '@/lib/errors';

/** What a client component sees when a route refuses: the server's message and field errors. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldErrors = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export async function apiFetch<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, {
      method: init.method ?? 'GET',
      headers: init.body === undefined ? {} : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach Kerfline. Check the connection and try again.');
  }
  if (res.status === 204) return undefined as T;
  const data: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const err = (data as Partial<ErrorBody> | null)?.error;
    throw new ApiError(res.status, err?.code ?? 'unknown', err?.message ?? `The request failed (${res.status}).`, err?.fields ?? {});
  }
  return data as T;
}
