import { noContent, route } from '@/lib/api/handler';
import { deleteStock, updateStock } from '@/lib/stock/queries';
import { createStockSchema, stockParamsSchema } from '@/lib/stock/schemas';

export const PUT = route({ params: stockParamsSchema, body: createStockSchema, channel: 'cutlist.edit' }, async ({ member, params, body }) => ({
  stockItem: await updateStock(member.channel.id, params.stockId, body),
}));

export const DELETE = route({ params: stockParamsSchema, channel: 'cutlist.edit' }, async ({ member, params }) => {
  await deleteStock(member.channel.id, params.stockId);
  return noContent();
});
