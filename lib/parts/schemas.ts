import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { lengthInput } from '@/lib/stock/schemas';

export const grains = ['length', 'any'] as const;
export type Grain = (typeof grains)[number];

const fields = {
  name: z.string({ error: 'Name the part.' }).trim().min(1, 'Name the part.').max(80, 'Keep part names under 80 characters.').refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE),
  quantity: z
    .number({ error: 'Enter how many, as a whole number.' })
    .int('Enter how many, as a whole number.')
    .min(1, 'At least 1.')
    .max(500, 'At most 500 of one part.'),
  lengthIn: lengthInput('a finished length', 1200),
  widthIn: lengthInput('a finished width', 1200).nullable(),
  thicknessIn: lengthInput('a finished thickness', 24).nullable(),
  stockItemId: z.uuid({ error: 'Choose stock from the rack.' }).nullable(),
  grain: z.enum(grains, { error: 'Choose along the length or any direction.' }),
  note: z.string().trim().max(200, 'Keep the note under 200 characters.'),
};

export const createPartSchema = z.strictObject({
  ...fields,
  widthIn: fields.widthIn.default(null),
  thicknessIn: fields.thicknessIn.default(null),
  stockItemId: fields.stockItemId.default(null),
  grain: fields.grain.default('any'),
  note: fields.note.default(''),
});
export type CreatePartInput = z.infer<typeof createPartSchema>;

export const updatePartSchema = z
  .strictObject({
    name: fields.name.optional(),
    quantity: fields.quantity.optional(),
    lengthIn: fields.lengthIn.optional(),
    widthIn: fields.widthIn.optional(),
    thicknessIn: fields.thicknessIn.optional(),
    stockItemId: fields.stockItemId.optional(),
    grain: fields.grain.optional(),
    note: fields.note.optional(),
    cutCount: z.number({ error: 'Enter how many are cut.' }).int('Use a whole number.').min(0, 'At least 0.').max(500).optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Change at least one field.');
export type UpdatePartInput = z.infer<typeof updatePartSchema>;

export const segmentPartsParamsSchema = z.object({ channel: channelSlugSchema, segmentId: z.uuid() });
export const partParamsSchema = z.object({ channel: channelSlugSchema, partId: z.uuid() });

export type PartDto = {
  id: string;
  segmentId: string;
  stockItemId: string | null;
  name: string;
  quantity: number;
  lengthIn: number;
  widthIn: number | null;
  thicknessIn: number | null;
  grain: Grain;
  note: string;
  cutCount: number;
};
