import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { personNameSchema, channelNameSchema } from '@/lib/users/schemas';
import { createPartSchema } from '@/lib/parts/schemas';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from './visible-name';

describe('isVisibleName', () => {
  it.each([
    ['zero-width space', 'Ro\u200Bwan'],
    ['right-to-left override', 'Invoice \u202Egpj.exe'],
    ['left-to-right isolate', '\u2066Tallowmere\u2069'],
    ['right-to-left mark', 'Mira\u200F'],
    ['byte order mark', '\uFEFFOak'],
    ['word joiner', 'Oak\u2060 table'],
    ['stray zero-width joiner', '\u200DHost'],
    ['soft hyphen', 'Dove\u00ADtail'],
    ['control character', 'Shop\u0007 hand'],
  ])('refuses a %s', (_what, name) => {
    expect(isVisibleName(name)).toBe(false);
  });

  it.each(['Rowan Ashby', 'Chêne massif', 'میز\u200Cها', 'क्ष\u200Dत्र', '👩\u200D🔧 Workshop', 'ヒノキの箱', 'Mesa de nogal – v2'])(
    'keeps %j',
    (name) => {
      expect(isVisibleName(name)).toBe(true);
    },
  );
});

describe('name schemas share the refinement', () => {
  const fieldError = (schema: z.ZodType, value: unknown) => {
    const r = schema.safeParse(value);
    return r.success ? null : r.error.issues[0]?.message;
  };

  it('person, channel and part names refuse invisible characters with a clear message', () => {
    expect(fieldError(personNameSchema, 'Ro\u200Bwan')).toBe(INVISIBLE_CHARACTERS_MESSAGE);
    expect(fieldError(channelNameSchema, 'Tallow\u202Emere')).toBe(INVISIBLE_CHARACTERS_MESSAGE);
    expect(fieldError(createPartSchema.shape.name, 'Le\u200Bg')).toBe(INVISIBLE_CHARACTERS_MESSAGE);
  });
});
