import { route } from '@/lib/api/handler';
import { episodeParamsSchema } from '@/lib/episodes/schemas';
import { diffHandoffs } from '@/lib/handoffs/diff';
import { findTwoSnapshots } from '@/lib/handoffs/queries';
import { diffQuerySchema } from '@/lib/handoffs/schemas';

/** What changed from version `from` to version `to` (either order works; the diff reads old to new as given). */
export const GET = route({ params: episodeParamsSchema, query: diffQuerySchema, channel: 'handoff.read' }, async ({ member, params, query }) => {
  const [a, b] = await findTwoSnapshots(member.channel.id, params.episodeId, query.from, query.to);
  return { diff: diffHandoffs(a, b) };
});
