import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { LumberParseError, parseNominalProfile, parseQuarters } from '@/lib/lumber';
import { LengthParseError, parseLength } from '@/lib/units';

export const stockKinds = ['softwood', 'hardwood', 'sheet'] as const;
export type StockKind = (typeof stockKinds)[number];
export const stockKindLabels: Record<StockKind, string> = {
  softwood: 'Dimensional softwood',
  hardwood: 'Hardwood boards',
  sheet: 'Sheet goods',
};

export const lengthUnits = ['in', 'mm'] as const;
export type LengthUnit = (typeof lengthUnits)[number];

/** A length typed as a woodworker writes it (`2' 8 1/2"`, `813mm`) or a number of inches. */
export const lengthInput = (what: string, maxIn: number, minIn = 0) =>
  z.union([z.number(), z.string()], { error: `Enter ${what}, like 32 1/2 or 813mm.` }).transform((v, ctx) => {
    let inches: number;
    try {
      inches = typeof v === 'number' ? v : parseLength(v);
    } catch (e) {
      if (!(e instanceof LengthParseError)) throw e;
      ctx.addIssue({ code: 'custom', message: e.message });
      return z.NEVER;
    }
    if (!Number.isFinite(inches) || inches <= minIn || inches > maxIn) {
      ctx.addIssue({ code: 'custom', message: `Enter ${what} over ${minIn} and up to ${maxIn} inches.` });
      return z.NEVER;
    }
    return inches;
  });

/** Dollars from a form ("6.20", 6.2) to whole cents. */
const priceInput = z
  .union([z.number(), z.string().trim().regex(/^\$?\d+(\.\d{1,2})?$/, 'Enter a price like 6.20.')], { error: 'Enter a price like 6.20.' })
  .transform((v) => Math.round(Number(typeof v === 'string' ? v.replace('$', '') : v) * 100))
  .refine((c) => Number.isFinite(c) && c > 0 && c <= 10_000_000, 'Enter a price above 0 and up to 100,000.');

const species = z.string({ error: 'Name the species or material.' }).trim().min(1, 'Name the species or material.').max(80, 'Keep it under 80 characters.').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE);

const profile = z.string({ error: 'Write a lumber size like 2x4.' }).transform((v, ctx) => {
  try {
    const p = parseNominalProfile(v);
    return `${p.nominalThickness}x${p.nominalWidth}`;
  } catch (e) {
    if (!(e instanceof LumberParseError)) throw e;
    ctx.addIssue({ code: 'custom', message: e.message });
    return z.NEVER;
  }
});

const quarters = z.string({ error: 'Write a thickness in quarters, like 4/4.' }).transform((v, ctx) => {
  try {
    const q = parseQuarters(v);
    if (q > 4) throw new LumberParseError(v, 'Use at most 16/4.');
    return `${Math.round(q * 4)}/4`;
  } catch (e) {
    if (!(e instanceof LumberParseError)) throw e;
    ctx.addIssue({ code: 'custom', message: e.message });
    return z.NEVER;
  }
});

const lumberLength = lengthInput('a board length', 480, 6);
const lumberOffers = <T extends z.ZodType>(item: T) =>
  z.array(item, { error: 'List the sizes on sale.' }).min(1, 'List at least one size on sale.').max(12, 'List at most 12 sizes.');

const round4 = (n: number) => Math.round(n * 10000) / 10000;
/** One size on sale, to 1/10000 inch: "96" for a board, "48x96" for a sheet. The planner and the shopping ticks use it too. */
export const offerSizeKey = (lengthIn: number, widthIn?: number) => (widthIn === undefined ? `${round4(lengthIn)}` : `${round4(widthIn)}x${round4(lengthIn)}`);

// Same key as the planner: sizes it would take as one must be refused here, not fail the plan.
const uniqueSizes = (offers: { lengthIn: number; widthIn?: number }[]) => new Set(offers.map((o) => offerSizeKey(o.lengthIn, o.widthIn))).size === offers.length;
// The refinement sits on the offers array, so its issue already carries the path `offers`.
const duplicateMessage = { message: 'Each size is listed once.' };

export const createStockSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('softwood'),
      species,
      nominal: profile,
      offers: lumberOffers(z.strictObject({ lengthIn: lumberLength, price: priceInput })).refine(uniqueSizes, duplicateMessage),
    }),
    z.strictObject({
      kind: z.literal('hardwood'),
      species,
      nominal: quarters,
      pricePerBoardFoot: priceInput,
      // Issue 16: each size on sale is a width and a length ("7 1/4 x 8'"), priced by the board foot.
      offers: lumberOffers(z.strictObject({ widthIn: lengthInput('a board width', 48), lengthIn: lumberLength })).refine(uniqueSizes, duplicateMessage),
    }),
    z.strictObject({
      kind: z.literal('sheet'),
      species,
      nominal: lengthInput('a sheet thickness', 2),
      plywood: z.boolean({ error: 'Say whether it is plywood.' }).default(true),
      offers: lumberOffers(
        z.strictObject({ widthIn: lengthInput('a sheet width', 120, 6), lengthIn: lengthInput('a sheet length', 240, 6), price: priceInput }),
      ).refine(uniqueSizes, duplicateMessage),
    }),
  ],
  { error: 'Choose softwood, hardwood or sheet goods.' },
);
export type CreateStockInput = z.infer<typeof createStockSchema>;

/** A shop setting length that may be zero (kerf, end trim). */
const settingLength = (message: string, max: number) =>
  z.union([z.number(), z.string()], { error: message }).transform((v, ctx) => {
    try {
      const n = typeof v === 'number' ? v : parseLength(v);
      if (Number.isFinite(n) && n >= 0 && n <= max) return n;
    } catch (e) {
      if (!(e instanceof LengthParseError)) throw e;
    }
    ctx.addIssue({ code: 'custom', message });
    return z.NEVER;
  });

export const cutSettingsSchema = z
  .strictObject({
    kerfIn: settingLength('Enter a kerf from 0 to 1 inch, like 1/8.', 1).optional(),
    endTrimIn: settingLength('Enter an end trim from 0 to 24 inches, like 1/2.', 24).optional(),
    minOffcutIn: settingLength('Enter the smallest offcut worth keeping, 0 to 240 inches.', 240).optional(),
    jointIn: settingLength('Enter what jointing takes off a ripped edge, 0 to 1 inch, like 1/16.', 1).optional(),
    lengthUnit: z.enum(lengthUnits, { error: 'Choose inches or millimetres.' }).optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Change at least one setting.');
export type CutSettingsInput = z.infer<typeof cutSettingsSchema>;

export const stockParamsSchema = z.object({ channel: channelSlugSchema, stockId: z.uuid() });

export type LumberOffer = { lengthIn: number; priceCents: number };
export type SheetOffer = { widthIn: number; lengthIn: number; priceCents: number };
/** A hardwood board on sale: its width and length; the price comes from the item's price per board foot (priceCents is 0). */
export type HardwoodOffer = { widthIn: number; lengthIn: number; priceCents: number };

export type StockItemDto = {
  id: string;
  kind: StockKind;
  name: string;
  species: string;
  nominal: string;
  thicknessIn: number;
  /** Actual width of lumber (hardwood: its widest board on sale); null for sheet goods. */
  widthIn: number | null;
  pricePerBoardFootCents: number | null;
  /** Softwood and sheets carry their own price; hardwood boards (width x length) are priced by the board foot. */
  offers: (LumberOffer | SheetOffer | HardwoodOffer)[];
};

export type CutSettingsDto = { kerfIn: number; endTrimIn: number; minOffcutIn: number; jointIn: number; lengthUnit: LengthUnit };
// Common practice, no published source: 1/16" lost to jointing each ripped edge.
export const DEFAULT_CUT_SETTINGS: CutSettingsDto = { kerfIn: 0.125, endTrimIn: 0, minOffcutIn: 12, jointIn: 0.0625, lengthUnit: 'in' };
