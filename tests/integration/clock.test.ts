import { afterEach, describe, expect, it } from 'vitest';
import { now, setClockOffset } from '@/lib/clock/queries';

describe('the app clock', () => {
  afterEach(async () => {
    await setClockOffset(0);
  });

  it('moves by the stored offset only when KERFLINE_TEST_CLOCK=1', async () => {
    await setClockOffset(3 * 86_400);
    const real = Date.now();
    expect(Math.abs((await now(false)).getTime() - real)).toBeLessThan(5_000);
    const moved = (await now(true)).getTime() - Date.now();
    expect(moved).toBeGreaterThan(3 * 86_400_000 - 5_000);
    expect(moved).toBeLessThan(3 * 86_400_000 + 5_000);
  });
});
