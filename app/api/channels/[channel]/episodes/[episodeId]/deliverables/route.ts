import { route } from '@/lib/api/handler';
import { episodeParamsSchema } from '@/lib/episodes/schemas';
import { listEpisodeDeliverables } from '@/lib/sponsors/deliverable-queries';

// The Editor's view of an episode's sponsor reads: talking points and disclosure, never fees.
export const GET = route({ params: episodeParamsSchema, channel: 'sponsors.readDisclosure' }, async ({ member, params }) => ({
  deliverables: await listEpisodeDeliverables(member.channel.id, params.episodeId),
}));
