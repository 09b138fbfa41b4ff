import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitPieceLabel, labelHeight, labelWidth } from './piece-label';

describe('fitPieceLabel', () => {
  it('keeps the whole label on a long piece', () => {
    expect(fitPieceLabel('Leg', '32 1/2"', { width: 400, height: 60 }, 28, 12)).toEqual({ text: 'Leg 32 1/2"', fontSize: 28 });
  });
  it('drops to the size, then a shortened name, then nothing as the piece gets shorter (issue 15)', () => {
    expect(fitPieceLabel('Stretcher', '14"', { width: 80, height: 60 }, 28, 12)?.text).toBe('14"');
    expect(fitPieceLabel('Stretcher', '14 3/16"', { width: 60, height: 60 }, 28, 12)?.text).toBe('Stretc…');
    expect(fitPieceLabel('Stretcher', '14"', { width: 20, height: 60 }, 28, 12)).toBeNull();
    expect(fitPieceLabel('Leg', '14"', { width: 200, height: 8 }, 28, 12)).toBeNull();
    // A thin ripped strip: the line (ascent plus descent), not just the font size, must fit its height.
    expect(fitPieceLabel('Leg', '24"', { width: 400, height: 22 }, 28, 12)).toBeNull();
    expect(fitPieceLabel('Leg', '24"', { width: 400, height: 30 }, 28, 12)?.fontSize).toBeCloseTo(22 / 1.3, 6);
  });
  it('never draws text wider or taller than its piece', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 40 }), fc.string({ minLength: 1, maxLength: 16 }), fc.double({ min: 1, max: 1000, noNaN: true }), fc.double({ min: 1, max: 400, noNaN: true }), (name, size, width, height) => {
        const label = fitPieceLabel(name, size, { width, height }, 28, 12);
        if (!label) return;
        expect(labelWidth(label)).toBeLessThanOrEqual(width - 8 + 1e-9);
        expect(labelHeight(label)).toBeLessThanOrEqual(height - 8 + 1e-9);
        expect(label.fontSize).toBeGreaterThanOrEqual(12 - 1e-9);
      }),
    );
  });
});
