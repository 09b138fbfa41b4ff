'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import type { z } from 'zod';
import { fieldErrorsOfFailure, validateForm } from '@/lib/api/form';
import type { FieldErrors } from '@/lib/errors';

/**
 * The steps every form repeats: parse the values with the shared zod schema (field messages at once,
 * nothing sent), send what parsed, and show the server's field messages or message when it refuses.
 * `mutation.error` carries the server's message for an Alert; `fields` feeds each field's `error`.
 */
export function useSchemaForm<S extends z.ZodType, R>({
  schema,
  send,
  onSuccess,
}: {
  schema: S;
  send: (input: z.output<S>) => Promise<R>;
  onSuccess?: (result: R) => unknown;
}) {
  const [fields, setFields] = useState<FieldErrors>({});
  const mutation = useMutation({
    mutationFn: send,
    onSuccess: (result) => onSuccess?.(result),
    onError: (error) => setFields(fieldErrorsOfFailure(error)),
  });
  function submit(raw: unknown) {
    const checked = validateForm(schema, raw);
    if (!checked.ok) return setFields(checked.fields);
    setFields({});
    mutation.mutate(checked.data);
  }
  return { fields, submit, mutation };
}
