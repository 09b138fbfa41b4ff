import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';

export const episodePlanParamsSchema = z.object({ channel: channelSlugSchema, episodeId: z.uuid() });
export const segmentPlanParamsSchema = z.object({ channel: channelSlugSchema, segmentId: z.uuid() });

export const shoppingTickSchema = z.strictObject({
  stockItemId: z.uuid({ error: 'Name the stock item.' }),
  // shopping_ticks.size_key is varchar(40).
  sizeKey: z.string({ error: 'Name the size.' }).max(40, 'Not a stock size.').regex(/^\d+(\.\d+)?(x\d+(\.\d+)?)?$/, 'Not a stock size.'),
  bought: z.number({ error: 'Enter how many are bought.' }).int('Use a whole number.').min(0, 'At least 0.').max(10000, 'At most 10,000.'),
});
export type ShoppingTickInput = z.infer<typeof shoppingTickSchema>;

export type ShoppingTickDto = { stockItemId: string; sizeKey: string; bought: number };
