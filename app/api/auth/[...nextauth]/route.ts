import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { checkedAuthRequest } from '@/lib/auth/auth-request';
import { authOptions } from '@/lib/auth/options';

// next-auth owns its own request handling (CSRF, callbacks); every other route uses lib/api.
const handler = NextAuth(authOptions) as (req: NextRequest, ctx: { params: Promise<{ nextauth: string[] }> }) => Promise<Response>;

// A malformed JSON body is a 400 here, not a 500 inside next-auth (lib/auth/auth-request.ts).
async function POST(req: NextRequest, ctx: { params: Promise<{ nextauth: string[] }> }): Promise<Response> {
  const checked = await checkedAuthRequest(req);
  return checked instanceof Response ? checked : handler(checked, ctx);
}

export { handler as GET, POST };
