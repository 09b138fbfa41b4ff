import { describe, expect, it } from 'vitest';
import { answerRange } from './range';

// Source: RFC 9110 §14.1.2, the byte-range examples for a representation of length 10000.
describe('answerRange', () => {
  const size = 10000;
  it('serves the examples of RFC 9110 as single ranges', () => {
    expect(answerRange('bytes=0-499', size)).toEqual({ status: 206, start: 0, end: 499 });
    expect(answerRange('bytes=500-999', size)).toEqual({ status: 206, start: 500, end: 999 });
    expect(answerRange('bytes=-500', size)).toEqual({ status: 206, start: 9500, end: 9999 });
    expect(answerRange('bytes=9500-', size)).toEqual({ status: 206, start: 9500, end: 9999 });
  });

  it('clamps an end past the last byte, as §14.1.2 says', () => {
    expect(answerRange('bytes=9000-20000', size)).toEqual({ status: 206, start: 9000, end: 9999 });
  });

  it('answers 416 when no range can be satisfied (§15.5.17)', () => {
    expect(answerRange('bytes=10000-', size)).toEqual({ status: 416 });
    expect(answerRange('bytes=0-0', 0)).toEqual({ status: 416 });
  });

  it('sends the whole file for no header, a malformed one, another unit or several ranges', () => {
    expect(answerRange(null, size)).toEqual({ status: 200 });
    expect(answerRange('bytes=abc', size)).toEqual({ status: 200 });
    expect(answerRange('items=0-5', size)).toEqual({ status: 200 });
    expect(answerRange('bytes=0-10,20-30', size)).toEqual({ status: 200 });
  });
});
