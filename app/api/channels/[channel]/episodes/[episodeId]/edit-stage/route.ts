import { route } from '@/lib/api/handler';
import { listEditStageHistory, setEditStage } from '@/lib/edit/queries';
import { setEditStageSchema } from '@/lib/edit/schemas';
import { episodeParamsSchema } from '@/lib/episodes/schemas';

export const GET = route({ params: episodeParamsSchema, channel: 'scripts.read' }, async ({ member, params }) => ({
  history: await listEditStageHistory(member.channel.id, params.episodeId),
}));

/** Editor and Host move the edit along; each change is kept with who and when. */
export const PUT = route({ params: episodeParamsSchema, body: setEditStageSchema, channel: 'editNotes.edit' }, async ({ member, user, params, body }) =>
  setEditStage(member, user, params.episodeId, body.stage),
);
