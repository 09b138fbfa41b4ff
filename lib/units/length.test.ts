import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatLength, LengthParseError, MM_PER_INCH, parseLength } from '.';

describe('parseLength', () => {
  it.each([
    ['32', 32],
    ['32.5', 32.5],
    ['32 1/2', 32.5],
    ['1-1/2', 1.5],
    ['1/2', 0.5],
    ['.75', 0.75],
    ['0', 0],
    [`2' 8 1/2"`, 32.5],
    [`2'8"`, 32],
    [`2'`, 24],
    ['8"', 8],
    ['2ft 8in', 32],
    ['2 ft', 24],
    ['2 feet 3 inches', 27],
    ['  32 1/2  ', 32.5],
    [`1' 7/8"`, 12.875],
  ])('%j is %d in', (text, inches) => {
    expect(parseLength(text)).toBeCloseTo(inches, 12);
  });

  it.each([
    ['813mm', 813 / 25.4],
    ['813 mm', 813 / 25.4],
    ['81.3cm', 813 / 25.4],
    ['0.8m', 800 / 25.4],
    ['25.4mm', 1],
  ])('%j is metric', (text, inches) => {
    expect(parseLength(text)).toBeCloseTo(inches, 12);
  });

  it('uses 25.4 mm per inch exactly', () => {
    // Source: NIST, international yard and pound agreement (1959): 1 in = 25.4 mm exactly.
    expect(MM_PER_INCH).toBe(25.4);
    expect(parseLength('254mm')).toBe(10);
  });

  it.each(['', '   ', '-3', '-1/2', '1/0', '3 1/0', '32 3/2', 'abc', '2x4', '3 mm mm', "2' -3\"", '1/2/3', '32,5', '5 yd'])(
    '%j is refused with a clear message',
    (text) => {
      expect(() => parseLength(text)).toThrow(LengthParseError);
      expect(() => parseLength(text)).toThrow('Write a length like 32 1/2, 2\' 8", or 813mm.');
    },
  );
});

describe('formatLength', () => {
  it.each([
    [32.5, '32 1/2"'],
    [0.75, '3/4"'],
    [96, '96"'],
    [0, '0"'],
    [1.03, '1"'],
    [1.0625, '1 1/16"'],
    [23 / 32, '3/4"'],
    [11.25, '11 1/4"'],
  ])('%d in prints as %s to the nearest 1/16', (inches, text) => {
    expect(formatLength(inches, { unit: 'in' })).toBe(text);
  });

  it('honours another denominator', () => {
    expect(formatLength(23 / 32, { unit: 'in', denominator: 32 })).toBe('23/32"');
    expect(formatLength(32.4, { unit: 'in', denominator: 2 })).toBe('32 1/2"');
    expect(() => formatLength(1, { unit: 'in', denominator: 0 })).toThrow(RangeError);
  });

  it('prints millimetres, with a tenth only when needed', () => {
    expect(formatLength(813 / 25.4, { unit: 'mm' })).toBe('813 mm');
    expect(formatLength(1, { unit: 'mm' })).toBe('25.4 mm');
    expect(formatLength(32, { unit: 'mm' })).toBe('812.8 mm');
  });

  it('refuses a number that is not a length', () => {
    expect(() => formatLength(Number.NaN, { unit: 'in' })).toThrow(RangeError);
  });

  it('round-trips: formatted to 1/16 then parsed is within 1/32 in', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 10_000, noNaN: true }), (inches) => {
        const back = parseLength(formatLength(inches, { unit: 'in', denominator: 16 }));
        expect(Math.abs(back - inches)).toBeLessThanOrEqual(1 / 32 + 1e-9);
      }),
    );
  });

  it('round-trips millimetres within 0.05 mm', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 10_000, noNaN: true }), (inches) => {
        const back = parseLength(formatLength(inches, { unit: 'mm' }).replace(' ', ''));
        expect(Math.abs(back - inches) * MM_PER_INCH).toBeLessThanOrEqual(0.05 + 1e-9);
      }),
    );
  });
});
