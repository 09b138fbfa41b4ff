'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import type { z } from 'zod';
import { fieldErrorsOfFailure, messageOfFailure, renameFields, validateForm } from '@/lib/api/form';
import type { FieldErrors } from '@/lib/errors';

type Shared<R> = {
  onSuccess?: (result: R) => unknown;
  /** Server field names shown under a differently named field of the form (`contacts.0.email` → `contactEmail`). */
  fieldNames?: Readonly<Record<string, string>>;
  /** The Alert's text when the failure is not a refusal from our API (a thrown sign-in, say). */
  failureMessage?: string;
};
type SubmitOptions<R> = { onSuccess?: (result: R) => unknown };

/**
 * The steps every form repeats once its values are read: send them, show the server's field messages
 * under their fields and its message in an Alert when it refuses, and say when it is pending.
 * `message` feeds the Alert, `fields` each field's `error`; `refuse` shows a check the form made itself
 * (a fee it could not read, say) without sending anything.
 */
export function useFormMutation<I, R>({ send, onSuccess, fieldNames = {}, failureMessage = 'Something went wrong. Try again.' }: Shared<R> & { send: (input: I) => Promise<R> }) {
  const [fields, setFields] = useState<FieldErrors>({});
  const mutation = useMutation<R, Error, I>({
    mutationFn: send,
    // Returned so a refetch started here keeps the form pending until fresh data is in.
    onSuccess: (result) => onSuccess?.(result),
    onError: (error) => setFields(renameFields(fieldErrorsOfFailure(error), fieldNames)),
  });
  function submit(input: I, options?: SubmitOptions<R>) {
    setFields({});
    mutation.mutate(input, options?.onSuccess ? { onSuccess: (result) => void options.onSuccess?.(result) } : undefined);
  }
  function refuse(local: FieldErrors, { reset = false }: { reset?: boolean } = {}) {
    if (reset) mutation.reset();
    setFields(local);
  }
  /** Forgets the last answer and every field message (a closed editor, a later success elsewhere). */
  function clear() {
    mutation.reset();
    setFields({});
  }
  const message = mutation.isError ? messageOfFailure(mutation.error, failureMessage) : null;
  return { fields, submit, refuse, clear, mutation, message };
}

/**
 * useFormMutation for forms whose values have a shared zod schema: parse them first (field messages at
 * once, nothing sent), then send what parsed. `send` also gets the raw values, for routes that parse
 * text the form keeps as typed ("15:00"). `resetOnInvalid` drops the last answer's Alert when the new
 * values do not parse.
 */
export function useSchemaForm<S extends z.ZodType, R>({
  schema,
  send,
  resetOnInvalid = false,
  ...shared
}: Shared<R> & { schema: S; send: (input: z.output<S>, raw: unknown) => Promise<R>; resetOnInvalid?: boolean }) {
  const form = useFormMutation<{ input: z.output<S>; raw: unknown }, R>({ ...shared, send: ({ input, raw }) => send(input, raw) });
  function submit(raw: unknown, options?: SubmitOptions<R>) {
    const checked = validateForm(schema, raw);
    if (!checked.ok) return form.refuse(checked.fields, { reset: resetOnInvalid });
    form.submit({ input: checked.data, raw }, options);
  }
  return { ...form, submit };
}
