import { route } from '@/lib/api/handler';
import { markCutsDone } from '@/lib/cut-plans/record-queries';
import { episodePlanParamsSchema, markCutsDoneSchema } from '@/lib/cut-plans/schemas';

// POST, not PUT: each press plans what is left and records it; a press with nothing left changes nothing.
export const POST = route({ params: episodePlanParamsSchema, body: markCutsDoneSchema, channel: 'cutlist.edit' }, async ({ member, params, body, user }) =>
  markCutsDone(member.channel.id, params.episodeId, user.id, body.stockItemId),
);
