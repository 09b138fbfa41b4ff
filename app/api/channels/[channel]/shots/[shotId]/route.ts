import { noContent, route } from '@/lib/api/handler';
import { deleteShot, findShot, listShotEvents, updateShot } from '@/lib/shots/queries';
import { shotParamsSchema, updateShotSchema } from '@/lib/shots/schemas';

export const GET = route({ params: shotParamsSchema, channel: 'member' }, async ({ member, params }) => ({
  shot: await findShot(member.channel.id, params.shotId),
  history: await listShotEvents(member.channel.id, params.shotId),
}));

// The route lets a Shop hand in; lib/shots/policy.ts then holds them to their own shots.
export const PATCH = route({ params: shotParamsSchema, body: updateShotSchema, channel: 'shots.editAssigned' }, async ({ member, params, body }) => ({
  shot: await updateShot(member, params.shotId, body),
}));

export const DELETE = route({ params: shotParamsSchema, channel: 'shots.edit' }, async ({ member, params }) => {
  await deleteShot(member.channel.id, params.shotId);
  return noContent();
});
