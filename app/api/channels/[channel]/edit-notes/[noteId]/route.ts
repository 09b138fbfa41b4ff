import { route } from '@/lib/api/handler';
import { setNoteResolved } from '@/lib/edit/queries';
import { noteParamsSchema, resolveNoteSchema } from '@/lib/edit/schemas';

/** Resolve or reopen a thread. */
export const PATCH = route({ params: noteParamsSchema, body: resolveNoteSchema, channel: 'editNotes.edit' }, async ({ member, user, params, body }) => ({
  note: await setNoteResolved(member, user, params.noteId, body.resolved),
}));
