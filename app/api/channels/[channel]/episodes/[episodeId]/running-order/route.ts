import { route } from '@/lib/api/handler';
import { episodeParamsSchema } from '@/lib/episodes/schemas';
import { getRunningOrder } from '@/lib/segments/queries';

export const GET = route({ params: episodeParamsSchema, channel: 'scripts.read' }, async ({ member, params }) => getRunningOrder(member, params.episodeId));
