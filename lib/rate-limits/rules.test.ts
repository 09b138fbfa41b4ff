import { describe, expect, it } from 'vitest';
import { SIGN_IN_BACKOFF, backoffDelaySeconds } from './rules';

describe('backoffDelaySeconds', () => {
  it('lets the first tries through with no wait, then doubles up to the cap', () => {
    const waits = Array.from({ length: 14 }, (_, i) => backoffDelaySeconds(SIGN_IN_BACKOFF, i + 1));
    expect(waits).toEqual([0, 0, 0, 0, 1, 2, 4, 8, 16, 32, 60, 60, 60, 60]);
  });

  it('never locks anyone out for longer than the cap, however many tries', () => {
    expect(backoffDelaySeconds(SIGN_IN_BACKOFF, 10_000)).toBe(SIGN_IN_BACKOFF.maxDelaySeconds);
  });
});
