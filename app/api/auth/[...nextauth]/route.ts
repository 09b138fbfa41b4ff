import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';

// next-auth owns its own request handling (CSRF, callbacks); every other route uses lib/api.
const handler = NextAuth(authOptions);

export { handler as GET, handler as POST };
