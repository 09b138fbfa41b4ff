import { describe, expect, it } from 'vitest';
import { countOf } from './count-of';

describe('countOf', () => {
  it('takes the singular for exactly one and the plural otherwise, zero included', () => {
    expect(countOf(1, 'board', 'boards')).toBe('1 board');
    expect(countOf(0, 'board', 'boards')).toBe('0 boards');
    expect(countOf(3, 'sheet is', 'sheets are')).toBe('3 sheets are');
  });
});
