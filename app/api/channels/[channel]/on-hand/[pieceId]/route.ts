import { noContent, route } from '@/lib/api/handler';
import { removeOnHand, updateOnHand } from '@/lib/on-hand/queries';
import { onHandParamsSchema, updateOnHandSchema } from '@/lib/on-hand/schemas';

export const PATCH = route({ params: onHandParamsSchema, body: updateOnHandSchema, channel: 'cutlist.edit' }, async ({ member, params, body }) => ({
  piece: await updateOnHand(member.channel.id, params.pieceId, body),
}));

export const DELETE = route({ params: onHandParamsSchema, channel: 'cutlist.edit' }, async ({ member, params }) => {
  await removeOnHand(member.channel.id, params.pieceId);
  return noContent();
});
