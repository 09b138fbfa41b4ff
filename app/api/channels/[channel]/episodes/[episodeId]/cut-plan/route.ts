import { route } from '@/lib/api/handler';
import { planEpisode } from '@/lib/cut-plans/queries';
import { episodePlanParamsSchema } from '@/lib/cut-plans/schemas';

export const GET = route({ params: episodePlanParamsSchema, channel: 'cutlist.read' }, async ({ member, params }) => planEpisode(member.channel.id, params.episodeId));
