import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDays } from '@/lib/sponsors/dates';
import { OVERDUE, reminderStage, thresholdsOf } from './plan';

describe('reminderStage', () => {
  it.each([
    ['2027-03-10', '2027-03-06', null],
    ['2027-03-10', '2027-03-07', 3],
    ['2027-03-10', '2027-03-08', 3],
    ['2027-03-10', '2027-03-09', 1],
    ['2027-03-10', '2027-03-10', 1],
    ['2027-03-10', '2027-03-11', OVERDUE],
  ])('due %s on %s is %s', (due, today, stage) => {
    expect(reminderStage(due, today, [3, 1])).toBe(stage);
  });

  it('a later day never goes back to a looser stage', () => {
    const order = (s: number | null) => (s === null ? 1000 : s === OVERDUE ? -1 : s);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 40 }), fc.uniqueArray(fc.integer({ min: 0, max: 14 }), { minLength: 1, maxLength: 4 }), (a, b, ts) => {
        const due = '2027-06-30';
        const [early, late] = a <= b ? [a, b] : [b, a];
        expect(order(reminderStage(due, addDays('2027-06-01', late), ts))).toBeLessThanOrEqual(order(reminderStage(due, addDays('2027-06-01', early), ts)));
      }),
    );
  });
});

describe('thresholdsOf', () => {
  it('reads the stored setting or defaults to 3 and 1', () => {
    expect(thresholdsOf([7, 2])).toEqual([7, 2]);
    expect(thresholdsOf(null)).toEqual([3, 1]);
    expect(thresholdsOf(['x', -1])).toEqual([3, 1]);
  });
});
