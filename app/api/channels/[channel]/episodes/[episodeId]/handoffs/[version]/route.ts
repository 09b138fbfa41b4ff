import { route } from '@/lib/api/handler';
import { findHandoff } from '@/lib/handoffs/queries';
import { handoffParamsSchema } from '@/lib/handoffs/schemas';

export const GET = route({ params: handoffParamsSchema, channel: 'handoff.read' }, async ({ member, params }) => ({
  handoff: await findHandoff(member.channel.id, params.episodeId, params.version),
}));
