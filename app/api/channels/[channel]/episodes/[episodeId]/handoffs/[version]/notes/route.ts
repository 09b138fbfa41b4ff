import { created, route } from '@/lib/api/handler';
import { createNote, listVersionNotes } from '@/lib/edit/queries';
import { createNoteSchema } from '@/lib/edit/schemas';
import { handoffParamsSchema } from '@/lib/handoffs/schemas';

export const GET = route({ params: handoffParamsSchema, channel: 'handoff.read' }, async ({ member, params }) => ({
  notes: await listVersionNotes(member.channel.id, params.episodeId, params.version),
}));

export const POST = route({ params: handoffParamsSchema, body: createNoteSchema, channel: 'editNotes.edit' }, async ({ member, user, params, body }) =>
  created({ note: await createNote(member, user, params.episodeId, params.version, body) }),
);
