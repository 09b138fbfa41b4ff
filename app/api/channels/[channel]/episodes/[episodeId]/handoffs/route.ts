import { created, route } from '@/lib/api/handler';
import { episodeParamsSchema } from '@/lib/episodes/schemas';
import { listHandoffs, lockHandoff } from '@/lib/handoffs/queries';
import { lockHandoffSchema } from '@/lib/handoffs/schemas';

export const GET = route({ params: episodeParamsSchema, channel: 'handoff.read' }, async ({ member, params }) => ({
  handoffs: await listHandoffs(member.channel.id, params.episodeId),
}));

/** "Lock for edit": the next immutable version of the episode, and one e-mail per Editor. */
export const POST = route({ params: episodeParamsSchema, body: lockHandoffSchema, channel: 'handoff.lock' }, async ({ member, user, params, body }) =>
  created({ handoff: await lockHandoff(member, user, params.episodeId, body) }),
);
