import type { z } from 'zod';
import type { FieldErrors } from '@/lib/errors';
import { ApiError } from './client';
import { fieldErrorsFrom } from './validation';

/** Checks a form's values against the schema the route handler uses, so both say the same thing. */
export function validateForm<S extends z.ZodType>(schema: S, raw: unknown): { ok: true; data: z.output<S> } | { ok: false; fields: FieldErrors } {
  const parsed = schema.safeParse(raw);
  return parsed.success ? { ok: true, data: parsed.data } : { ok: false, fields: fieldErrorsFrom(parsed.error) };
}

/** The field messages to show after a refused request: the server's, when it named fields. */
export const fieldErrorsOfFailure = (error: unknown): FieldErrors => (error instanceof ApiError ? error.fields : {});
