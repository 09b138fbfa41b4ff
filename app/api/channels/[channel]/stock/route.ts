import { created, route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { createStock, listStock } from '@/lib/stock/queries';
import { createStockSchema } from '@/lib/stock/schemas';

export const GET = route({ params: channelParamsSchema, channel: 'cutlist.read' }, async ({ member }) => ({ stock: await listStock(member.channel.id) }));

export const POST = route({ params: channelParamsSchema, body: createStockSchema, channel: 'cutlist.edit' }, async ({ member, body }) =>
  created({ stockItem: await createStock(member.channel.id, body) }),
);
