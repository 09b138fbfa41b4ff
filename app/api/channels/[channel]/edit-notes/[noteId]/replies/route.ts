import { created, route } from '@/lib/api/handler';
import { replyToNote } from '@/lib/edit/queries';
import { noteParamsSchema, replySchema } from '@/lib/edit/schemas';

export const POST = route({ params: noteParamsSchema, body: replySchema, channel: 'editNotes.edit' }, async ({ member, user, params, body }) =>
  created({ note: await replyToNote(member, user, params.noteId, body.body) }),
);
