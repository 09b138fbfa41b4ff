import 'server-only';
import { randomUUID } from 'node:crypto';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { config } from '@/lib/config';
import { safeRedirectUrl } from './redirect';
import { revokeSession } from './session-queries';
import { authorizeCredentials, clientIp } from './sign-in';

export const SESSION_MAX_AGE_SECONDS = 30 * 24 * 60 * 60;

export const authOptions: NextAuthOptions = {
  secret: config().NEXTAUTH_SECRET,
  // Cookies are Secure (and __Secure- prefixed) when NEXTAUTH_URL is https: next-auth's default.
  session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      authorize: (credentials, req) => authorizeCredentials(credentials, clientIp(req.headers)),
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        // sv: the user's session version at sign-in; sid: this session's own id, for sign-out.
        token.sv = 'sessionVersion' in user && typeof user.sessionVersion === 'number' ? user.sessionVersion : 0;
        token.sid = randomUUID();
      }
      return token;
    },
    session({ session, token }) {
      if (session.user && token.sub) session.user.id = token.sub;
      return session;
    },
    // Every callbackUrl next-auth redirects to passes the one same-origin check.
    redirect({ url, baseUrl }) {
      return safeRedirectUrl(url, baseUrl);
    },
  },
  events: {
    // Signing out ends this session on the server too, so a copied cookie stops working.
    async signOut({ token }) {
      if (token?.sub && typeof token.sid === 'string') {
        const exp = typeof token.exp === 'number' ? new Date(token.exp * 1000) : new Date(Date.now() + SESSION_MAX_AGE_SECONDS * 1000);
        await revokeSession(token.sub, token.sid, exp);
      }
    },
  },
};
