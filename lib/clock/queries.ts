import 'server-only';
import { db } from '@/db/client';
import { config } from '@/lib/config';

// The app's clock. Tests move time by storing an offset instead of sleeping; the offset is read only
// when KERFLINE_TEST_CLOCK=1, so a production process can never be moved by a database row.
const KEY = 'test_clock_offset_seconds';

/** Now, moved by the stored offset only in a test process (`testClock`, from KERFLINE_TEST_CLOCK). */
export async function now(testClock = config().KERFLINE_TEST_CLOCK): Promise<Date> {
  if (!testClock) return new Date();
  const row: { value: unknown } | undefined = await db('app_meta').where({ key: KEY }).first('value');
  const offset = typeof row?.value === 'number' ? row.value : 0;
  return new Date(Date.now() + offset * 1000);
}

/** Moves the test clock to `offsetSeconds` from the real time (tests only). */
export async function setClockOffset(offsetSeconds: number): Promise<void> {
  await db('app_meta').insert({ key: KEY, value: JSON.stringify(offsetSeconds) }).onConflict('key').merge(['value']);
}
