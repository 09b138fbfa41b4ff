import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { onHandSources } from '@/lib/on-hand/schemas';

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

/** "Take back" a cut record: the record in the URL. A malformed id names nothing (404). */
export const cutRecordParamsSchema = episodePlanParamsSchema.extend({ recordId: z.uuid() });

/**
 * An on-hand row a cut record pulled, as it was when "Mark these cuts done" locked it (cut_records.pulled_rows):
 * what taking the record back needs to put a used-up row back with its own id and provenance.
 * Read back through this schema, so a stored copy of another shape is never trusted.
 */
export const pulledRowSchema = z.strictObject({
  id: z.uuid(),
  lengthIn: z.number().positive(),
  widthIn: z.number().positive().nullable(),
  /** The row's count before the record pulled from it. */
  count: z.number().int().min(1),
  source: z.enum(onHandSources),
  episodeId: z.uuid().nullable(),
  cutRecordId: z.uuid().nullable(),
  createdBy: z.uuid().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
});
export const pulledRowsSchema = z.array(pulledRowSchema);
export type PulledRow = z.infer<typeof pulledRowSchema>;

/** What "Take back" did, in the numbers its confirmation promised. */
export type TakeBackResult = { recordId: string; piecesBack: number; offcutsRemoved: number; piecesUnticked: number };
