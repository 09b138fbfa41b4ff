import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll } from 'vitest';

if (!process.env.DATABASE_URL?.includes('_it')) {
  throw new Error('Integration tests need DATABASE_URL pointing at the integration database; run them through `npm test`.');
}
if (!process.env.NEXTAUTH_SECRET) throw new Error('NEXTAUTH_SECRET must be set for integration tests.');

// In-process clip stores write here, never into the project's .data. Set before anything reads
// lib/config (it reads the environment once), which is why the database client is imported lazily below.
process.env.UPLOAD_DIR ??= fs.mkdtempSync(path.join(os.tmpdir(), 'kerfline-it-uploads-'));

afterAll(async () => {
  const { db } = await import('@/db/client');
  await db.destroy();
});
