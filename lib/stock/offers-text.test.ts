import { describe, expect, it } from 'vitest';
import { offersToText, parseOffersText } from './offers-text';

describe('parseOffersText', () => {
  it('reads lumber, hardwood and sheet sizes', () => {
    expect(parseOffersText('softwood', '8ft 4.50; 10ft $6.20').offers).toEqual([
      { lengthIn: '8ft', price: '4.50' },
      { lengthIn: '10ft', price: '6.20' },
    ]);
    expect(parseOffersText('hardwood', '8ft\n10ft').offers).toEqual([{ lengthIn: '8ft' }, { lengthIn: '10ft' }]);
    expect(parseOffersText('sheet', '48 x 96 68.00').offers).toEqual([{ widthIn: '48', lengthIn: '96', price: '68.00' }]);
  });
  it('explains a line it cannot read', () => {
    expect(parseOffersText('softwood', '8ft').error).toMatch(/size then a price/);
    expect(parseOffersText('sheet', '96 68').error).toMatch(/width x length/);
    expect(parseOffersText('softwood', ' ').error).toMatch(/at least one/);
  });
  it('reads a list the ways people write one: commas, feet marks, one per line (issue 15)', () => {
    const eightAndTen = [{ lengthIn: '8 ft' }, { lengthIn: '10 ft' }];
    expect(parseOffersText('hardwood', '8 ft, 10 ft')).toEqual({ offers: eightAndTen });
    expect(parseOffersText('hardwood', "8', 10'").offers).toEqual([{ lengthIn: "8'" }, { lengthIn: "10'" }]);
    expect(parseOffersText('hardwood', "8',10'").offers).toEqual([{ lengthIn: "8'" }, { lengthIn: "10'" }]);
    expect(parseOffersText('hardwood', '8 ft\r\n10 ft\n').offers).toEqual(eightAndTen);
    expect(parseOffersText('softwood', "8' 4.50, 10' 6.20").offers).toEqual([
      { lengthIn: "8'", price: '4.50' },
      { lengthIn: "10'", price: '6.20' },
    ]);
  });
  it('names the part it did not understand', () => {
    expect(parseOffersText('hardwood', '8 ft, 10 fet').error).toBe('Could not read “10 fet” as a length: write lengths like 8 ft, 8\' or 96".');
    expect(parseOffersText('softwood', '8 ft 4.50, ten ft 6.20').error).toBe(
      'Could not read “ten ft” as a length in “ten ft 6.20”: write lengths like 8 ft, 8\' or 96".',
    );
    expect(parseOffersText('sheet', '4 yd x 96 68').error).toMatch(/“4 yd” as a width in “4 yd x 96 68”/);
  });
  it('round-trips what the rack shows', () => {
    const text = offersToText({
      id: 'x', kind: 'sheet', name: 'n', species: 's', nominal: '3/4', thicknessIn: 0.71875, widthIn: null, pricePerBoardFootCents: null,
      offers: [{ widthIn: 48, lengthIn: 96, priceCents: 6800 }],
    });
    expect(parseOffersText('sheet', text).offers).toEqual([{ widthIn: '48', lengthIn: '96', price: '68.00' }]);
  });
});
