// Imported first by s3.ts: ES imports run before the importing module's own code, and the database client
// reads DATABASE_URL when it is first imported, so the `npm start` database must be named here.
import fs from 'node:fs';

const PG_PORT = process.env.KERFLINE_PG_PORT ?? '54329';
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PG_PORT}/kerfline`;
process.env.NEXTAUTH_SECRET ??= fs.readFileSync('.data/session-secret', 'utf8').trim();
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
