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

/** The message for a form's Alert after a failed request: the server's, or the form's own fallback for anything else. */
export const messageOfFailure = (error: unknown, fallback: string): string => (error instanceof ApiError ? error.message : fallback);

/**
 * Shows a server field message under the form's own field when the two are named differently
 * (`contacts.0.email` → `contactEmail`). The form's name wins only when the server did not name it too.
 */
export function renameFields(fields: FieldErrors, names: Readonly<Record<string, string>>): FieldErrors {
  const out: FieldErrors = { ...fields };
  for (const [server, form] of Object.entries(names)) {
    const message = fields[server];
    if (message !== undefined) out[form] ??= message;
  }
  return out;
}
