import 'next-auth';
import 'next-auth/jwt';

declare module 'next-auth' {
  interface Session {
    user: { id: string; name?: string | null; email?: string | null };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    /** The user's session_version when this session began (lib/auth/options.ts). */
    sv?: number;
    /** This session's id; revoked on sign-out. */
    sid?: string;
  }
}
