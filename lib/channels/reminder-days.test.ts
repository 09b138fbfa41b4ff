import { describe, expect, it } from 'vitest';
import { fieldErrorsFrom } from '@/lib/api/validation';
import { parseReminderDays } from './reminder-days';
import { channelSettingsSchema, reminderDaysSchema } from './schemas';

const errorOf = (days: unknown) => {
  const parsed = channelSettingsSchema.safeParse({ reminderDays: days });
  return parsed.success ? null : fieldErrorsFrom(parsed.error);
};

describe('parseReminderDays', () => {
  it('reads commas, spaces and semicolons, keeping non-numbers as NaN for the schema to name', () => {
    expect(parseReminderDays('3, 1')).toEqual([3, 1]);
    expect(parseReminderDays(' 7 3;0 ')).toEqual([7, 3, 0]);
    expect(parseReminderDays('')).toEqual([]);
    expect(parseReminderDays('2.5, -1')).toEqual([2.5, -1]);
    expect(parseReminderDays('3, soon')).toEqual([3, Number.NaN]);
  });
});

describe('reminderDaysSchema', () => {
  it('takes one to five distinct whole days from 0 to 60', () => {
    expect(reminderDaysSchema.parse([0])).toEqual([0]);
    expect(reminderDaysSchema.parse([60, 14, 7, 3, 1])).toEqual([60, 14, 7, 3, 1]);
    expect(channelSettingsSchema.parse({ reminderDays: [3, 1] })).toEqual({ reminderDays: [3, 1] });
  });

  it('refuses each bad list with a message on the field', () => {
    expect(errorOf([])).toEqual({ reminderDays: 'Give at least one day (0 is the due day itself).' });
    expect(errorOf([1, 2, 3, 4, 5, 6])).toEqual({ reminderDays: 'Give at most 5 days.' });
    expect(errorOf([61])).toEqual({ reminderDays: 'Use whole days from 0 to 60.' });
    expect(errorOf([-1])).toEqual({ reminderDays: 'Use whole days from 0 to 60.' });
    expect(errorOf([1.5])).toEqual({ reminderDays: 'Use whole days from 0 to 60.' });
    expect(errorOf([3, 1, 3])).toEqual({ reminderDays: 'Give each day only once.' });
    expect(errorOf('3, 1')).toEqual({ reminderDays: 'Give the reminder days as a list, e.g. 3, 1.' });
    expect(errorOf([3, Number.NaN])).toEqual({ 'reminderDays.1': 'Use whole days, e.g. 3, 1.' });
  });
});
