import { noContent, route } from '@/lib/api/handler';
import { deletePart, updatePart } from '@/lib/parts/queries';
import { partParamsSchema, updatePartSchema } from '@/lib/parts/schemas';

export const PATCH = route({ params: partParamsSchema, body: updatePartSchema, channel: 'cutlist.edit' }, async ({ member, params, body }) => ({
  part: await updatePart(member.channel.id, params.partId, body),
}));

export const DELETE = route({ params: partParamsSchema, channel: 'cutlist.edit' }, async ({ member, params }) => {
  await deletePart(member.channel.id, params.partId);
  return noContent();
});
