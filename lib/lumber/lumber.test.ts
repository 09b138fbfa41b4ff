import { describe, expect, it } from 'vitest';
import {
  boardFeet,
  dressedSize,
  LumberParseError,
  parseNominalProfile,
  parseQuarters,
  plywoodActualThickness,
  softwoodBoardFeet,
} from '.';

describe('dressedSize', () => {
  // Source: American Softwood Lumber Standard, NIST Voluntary Product Standard PS 20 (dry dressed sizes).
  it.each([
    ['1x4', 0.75, 3.5],
    ['2x4', 1.5, 3.5],
    ['2x6', 1.5, 5.5],
    ['2x8', 1.5, 7.25],
    ['2x10', 1.5, 9.25],
    ['2x12', 1.5, 11.25],
    ['3x3', 2.5, 2.5],
    ['4x4', 3.5, 3.5],
  ])('%s is %d x %d in', (text, thickness, width) => {
    expect(dressedSize(parseNominalProfile(text))).toEqual({ thickness, width });
  });

  it('lists 14 -> 13 1/4', () => {
    // From memory: PS 20 dry width for nominal 14.
    expect(dressedSize({ nominalThickness: 2, nominalWidth: 14 }).width).toBe(13.25);
  });

  it("puts a 2x4's centre line 1 3/4 in from its edge", () => {
    // Common practice, no published source.
    expect(dressedSize(parseNominalProfile('2x4')).width / 2).toBe(1.75);
  });

  it('refuses a size that is not standard', () => {
    expect(() => dressedSize({ nominalThickness: 2, nominalWidth: 7 })).toThrow(RangeError);
  });
});

describe('parseNominalProfile', () => {
  it('reads the common spellings', () => {
    expect(parseNominalProfile('2x4')).toEqual({ nominalThickness: 2, nominalWidth: 4 });
    expect(parseNominalProfile(' 1 X 6 ')).toEqual({ nominalThickness: 1, nominalWidth: 6 });
    expect(parseNominalProfile('2×10')).toEqual({ nominalThickness: 2, nominalWidth: 10 });
  });

  it.each(['', '2x', 'x4', '2by4', '2.5x4', '2x7', '0x4', '2x4x8'])('refuses %j', (text) => {
    expect(() => parseNominalProfile(text)).toThrow(LumberParseError);
  });
});

describe('parseQuarters', () => {
  it.each([
    ['4/4', 1],
    ['5/4', 1.25],
    ['8/4', 2],
    [' 12 / 4 ', 3],
  ])('%s is %d in rough', (text, inches) => {
    expect(parseQuarters(text)).toBe(inches);
  });

  it.each(['', '0/4', '8/3', '4', 'four quarters', '-4/4'])('refuses %j', (text) => {
    expect(() => parseQuarters(text)).toThrow(LumberParseError);
  });
});

describe('board feet', () => {
  it('is thickness x width x length / 144 in cubic inches', () => {
    // Source: USDA Forest Products Laboratory, Wood Handbook: a board foot is 144 in³ (1 x 12 x 12 in).
    expect(boardFeet(1, 12, 12)).toBe(1);
    expect(boardFeet(2, 6, 96)).toBe(8);
  });

  it('counts softwood on nominal sizes: a 2x4 of 8 ft is 5 1/3 board feet', () => {
    // Source: USDA Forest Products Laboratory, Wood Handbook (board foot), nominal sizes per PS 20.
    expect(softwoodBoardFeet(parseNominalProfile('2x4'), 96)).toBeCloseTo(16 / 3, 12);
  });
});

describe('plywoodActualThickness', () => {
  it('makes nominal 3/4 plywood 23/32 actual', () => {
    // From memory: PS 1 / retail sizing, nominal 3/4 in sells as 23/32 in.
    expect(plywoodActualThickness(0.75)).toBe(23 / 32);
    // From memory: nominal 1/2 -> 15/32, 1/4 -> 7/32.
    expect(plywoodActualThickness(0.5)).toBe(15 / 32);
    expect(plywoodActualThickness(0.25)).toBe(7 / 32);
    expect(plywoodActualThickness(0.625)).toBeUndefined();
  });
});
