import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';

export const episodePlanParamsSchema = z.object({ channel: channelSlugSchema, episodeId: z.uuid() });
export const segmentPlanParamsSchema = z.object({ channel: channelSlugSchema, segmentId: z.uuid() });

/** One board or sheet of a size on the plan's shopping list, ticked (bought) or unticked. */
export const shoppingTickSchema = z.strictObject({
  stockItemId: z.uuid({ error: 'Name the stock item.' }),
  // shopping_board_ticks.size_key is varchar(40).
  sizeKey: z.string({ error: 'Name the size.' }).max(40, 'Not a stock size.').regex(/^\d+(\.\d+)?(x\d+(\.\d+)?)?$/, 'Not a stock size.'),
  // Boards of one size are numbered 1.. on the plan; the table's check allows 1 to 10,000.
  board: z.number({ error: 'Name the board by its number.' }).int('Use a whole number.').min(1, 'Boards are numbered from 1.').max(10000, 'At most board 10,000.'),
  bought: z.boolean({ error: 'Say whether it is bought.' }),
});
export type ShoppingTickInput = z.infer<typeof shoppingTickSchema>;

/** A board or sheet ticked as bought: board `board` of size `sizeKey` of the stock item. */
export type ShoppingTickDto = { stockItemId: string; sizeKey: string; board: number };

/** "Mark these cuts done" for one stock item of an episode's plan. */
export const markCutsDoneSchema = z.strictObject({ stockItemId: z.uuid({ error: 'Name the stock item.' }) });
export type MarkCutsDoneInput = z.infer<typeof markCutsDoneSchema>;
