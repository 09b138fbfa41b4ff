import { tusServer } from '@/storage/tus-server';

// tus 1.0 resumable uploads; the policy lives in storage/upload-hooks.ts. Not behind proxy.ts, which would cut bodies at 10 MB.
export const dynamic = 'force-dynamic';

const handle = (req: Request) => tusServer().handleWeb(req);

export { handle as DELETE, handle as GET, handle as HEAD, handle as OPTIONS, handle as PATCH, handle as POST };
