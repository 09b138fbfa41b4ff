import { z } from 'zod';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { lengthInput } from '@/lib/stock/schemas';

// The table's checks: length up to 480", width up to 120", 1 to 1,000 of a size.
const count = z.number({ error: 'Enter how many, as a whole number.' }).int('Enter how many, as a whole number.').min(1, 'At least 1.').max(1000, 'At most 1,000.');

/** A board or offcut added to the rack by hand. Sheets need a width; lumber takes its stock item's width. */
export const createOnHandSchema = z.strictObject({
  stockItemId: z.uuid({ error: 'Choose the stock it is.' }),
  lengthIn: lengthInput('a length', 480),
  widthIn: lengthInput('a width', 120).nullable().default(null),
  count: count.default(1),
});
export type CreateOnHandInput = z.infer<typeof createOnHandSchema>;

export const updateOnHandSchema = z.strictObject({ count });
export type UpdateOnHandInput = z.infer<typeof updateOnHandSchema>;

export const onHandParamsSchema = z.object({ channel: channelSlugSchema, pieceId: z.uuid() });

export const onHandSources = ['hand', 'kept'] as const;
export type OnHandSource = (typeof onHandSources)[number];

export type OnHandPieceDto = {
  id: string;
  stockItemId: string;
  stockName: string;
  kind: 'softwood' | 'hardwood' | 'sheet';
  lengthIn: number;
  /** Sheets: the piece's width; lumber: null (the stock item's width). */
  widthIn: number | null;
  count: number;
  source: OnHandSource;
  /** Kept offcuts: the episode whose cuts kept it, while it exists. */
  episodeId: string | null;
  episodeTitle: string | null;
  /** ISO time it came on hand. */
  addedAt: string;
};

/** What the planner needs of an on-hand piece. */
export type OnHandStock = Pick<OnHandPieceDto, 'id' | 'stockItemId' | 'lengthIn' | 'widthIn' | 'count'>;
