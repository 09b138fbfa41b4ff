'use client';

import { useState } from 'react';
import { useFormMutation } from './use-schema-form';

type Props<A, S> = {
  add: (body: A) => Promise<unknown>;
  save: (id: string, body: S) => Promise<unknown>;
  remove: (id: string) => Promise<unknown>;
  /** Refetches what the change touched; the forms stay pending until it is in. */
  refresh: () => Promise<unknown>;
  failureMessage: string;
};

/**
 * A list edited in place (parts, stock): an add form below it, one row at a time turned into an edit
 * form, a delete button per row, and one Alert for the list. Any success clears the other forms'
 * failures, so the Alert always speaks of the latest attempt; a saved add form comes back empty.
 */
export function useListEdits<A, S>({ add, save, remove, refresh, failureMessage }: Props<A, S>) {
  const [editing, setEditing] = useState<string | null>(null);
  const [addFormKey, setAddFormKey] = useState(0);
  const adding = useFormMutation<A, unknown>({
    send: add,
    failureMessage,
    onSuccess: () => {
      saving.clear();
      removing.clear();
      return refresh().then(() => setAddFormKey((k) => k + 1));
    },
  });
  const saving = useFormMutation<{ id: string; body: S }, unknown>({
    send: ({ id, body }) => save(id, body),
    failureMessage,
    onSuccess: () => {
      adding.clear();
      removing.clear();
      return refresh().then(() => setEditing(null));
    },
  });
  const removing = useFormMutation<string, unknown>({
    send: remove,
    failureMessage,
    onSuccess: () => {
      adding.clear();
      saving.clear();
      return refresh();
    },
  });
  function startEditing(id: string) {
    saving.clear();
    setEditing(id);
  }
  function stopEditing() {
    saving.clear();
    setEditing(null);
  }
  const message = removing.message ?? saving.message ?? adding.message;
  return { editing, startEditing, stopEditing, addFormKey, adding, saving, removing, message };
}
