import { describe, expect, it } from 'vitest';
import { offersToText, parseOffersText } from './offers-text';

describe('parseOffersText', () => {
  it('reads lumber, hardwood and sheet sizes', () => {
    expect(parseOffersText('softwood', '8ft 4.50; 10ft $6.20').offers).toEqual([
      { lengthIn: '8ft', price: '4.50' },
      { lengthIn: '10ft', price: '6.20' },
    ]);
    expect(parseOffersText('hardwood', '6 x 8ft\n7 1/4" x 10ft').offers).toEqual([
      { widthIn: '6', lengthIn: '8ft' },
      { widthIn: '7 1/4"', lengthIn: '10ft' },
    ]);
    expect(parseOffersText('sheet', '48 x 96 68.00').offers).toEqual([{ widthIn: '48', lengthIn: '96', price: '68.00' }]);
  });
  it('explains a line it cannot read', () => {
    expect(parseOffersText('softwood', '8ft').error).toMatch(/size then a price/);
    expect(parseOffersText('sheet', '96 68').error).toMatch(/width x length/);
    expect(parseOffersText('softwood', ' ').error).toMatch(/at least one/);
  });
  it('reads a list the ways people write one: commas, feet marks, one per line (issue 15)', () => {
    const eightAndTen = [{ widthIn: '6', lengthIn: '8 ft' }, { widthIn: '6', lengthIn: '10 ft' }];
    expect(parseOffersText('hardwood', '6 x 8 ft, 10 ft')).toEqual({ offers: eightAndTen });
    expect(parseOffersText('hardwood', `6" x 8', 10'`).offers).toEqual([{ widthIn: '6"', lengthIn: "8'" }, { widthIn: '6"', lengthIn: "10'" }]);
    expect(parseOffersText('hardwood', "6x8',10'").offers).toEqual([{ widthIn: '6', lengthIn: "8'" }, { widthIn: '6', lengthIn: "10'" }]);
    expect(parseOffersText('hardwood', '6 x 8 ft\r\n6 x 10 ft\n').offers).toEqual(eightAndTen);
    expect(parseOffersText('softwood', "8' 4.50, 10' 6.20").offers).toEqual([
      { lengthIn: "8'", price: '4.50' },
      { lengthIn: "10'", price: '6.20' },
    ]);
  });
  it('names the part it did not understand', () => {
    expect(parseOffersText('hardwood', '6 x 8 ft, 10 fet').error).toBe('Could not read “10 fet” as a length: write lengths like 8 ft, 8\' or 96".');
    expect(parseOffersText('softwood', '8 ft 4.50, ten ft 6.20').error).toBe(
      'Could not read “ten ft” as a length in “ten ft 6.20”: write lengths like 8 ft, 8\' or 96".',
    );
    expect(parseOffersText('sheet', '4 yd x 96 68').error).toMatch(/“4 yd” as a width in “4 yd x 96 68”/);
  });
  it('reads hardwood boards as width x length, a length alone keeping the width before it (issue 16)', () => {
    expect(parseOffersText('hardwood', `4" x 8', 10'; 5 1/2 x 8'; 7 1/4" × 8'`).offers).toEqual([
      { widthIn: '4"', lengthIn: "8'" },
      { widthIn: '4"', lengthIn: "10'" },
      { widthIn: '5 1/2', lengthIn: "8'" },
      { widthIn: '7 1/4"', lengthIn: "8'" },
    ]);
    expect(parseOffersText('hardwood', "8'").error).toBe(`“8'”: write the board as width x length, like 6" x 8'.`);
    expect(parseOffersText('hardwood', "6 x 8 x 10'").error).toMatch(/width x length/);
    expect(parseOffersText('hardwood', "wide x 8'").error).toBe(`Could not read “wide” as a width in “wide x 8'”: write lengths like 8 ft, 8' or 96".`);
  });
  it('round-trips a hardwood item of several widths', () => {
    const text = offersToText({
      id: 'x', kind: 'hardwood', name: 'n', species: 's', nominal: '4/4', thicknessIn: 1, widthIn: 7.25, pricePerBoardFootCents: 900,
      offers: [{ widthIn: 4, lengthIn: 96, priceCents: 0 }, { widthIn: 7.25, lengthIn: 120, priceCents: 0 }],
    });
    expect(text).toBe('4 x 96\n7 1/4 x 120');
    expect(parseOffersText('hardwood', text).offers).toEqual([{ widthIn: '4', lengthIn: '96' }, { widthIn: '7 1/4', lengthIn: '120' }]);
  });
  it('round-trips what the rack shows', () => {
    const text = offersToText({
      id: 'x', kind: 'sheet', name: 'n', species: 's', nominal: '3/4', thicknessIn: 0.71875, widthIn: null, pricePerBoardFootCents: null,
      offers: [{ widthIn: 48, lengthIn: 96, priceCents: 6800 }],
    });
    expect(parseOffersText('sheet', text).offers).toEqual([{ widthIn: '48', lengthIn: '96', price: '68.00' }]);
  });
});
