import { Client } from 'pg';

// The e2e app runs with KERFLINE_TEST_CLOCK=1 (playwright.config.ts), so its clock adds the offset kept
// in app_meta (lib/clock/queries.ts). The test writes that row directly: no route can move the clock.
const KEY = 'test_clock_offset_seconds';

async function withClient<T>(work: (client: Client) => Promise<T>): Promise<T> {
  const connectionString = process.env.DATABASE_URL;
  if (!connectionString) throw new Error('DATABASE_URL is not set: run the e2e tests through npm test');
  const client = new Client({ connectionString });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** Moves the e2e app's clock `days` whole days ahead of the real time (0 puts it back). */
export function moveClockBy(days: number): Promise<void> {
  return withClient(async (client) => {
    await client.query(
      `insert into app_meta (key, value) values ($1, $2::jsonb) on conflict (key) do update set value = excluded.value, updated_at = now()`,
      [KEY, JSON.stringify(days * 86_400)],
    );
  });
}

/** The calendar day `days` after today (UTC), as YYYY-MM-DD. */
export const dayFromToday = (days: number): string => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
