import 'server-only';
import { clientAddress } from '@/lib/http/peer';
import { credentialsSchema, type UserDto } from '@/lib/users/schemas';
import { findCredentialsByEmail } from '@/lib/users/queries';
import { burnPasswordCheck, verifyPassword } from './password';
import { claimTry, clearFailures, emailKey, forgiveTry, ipKey } from './throttle-queries';

export const SIGN_IN_FAILED_MESSAGE =
  'That e-mail and password did not match, or there were too many tries. Check them, or wait a minute and try again.';

export type SignedInUser = UserDto & { sessionVersion: number };

/** The credentials check behind next-auth. Returns null for every kind of failure, so nothing leaks. */
export async function authorizeCredentials(raw: unknown, ip: string): Promise<SignedInUser | null> {
  const parsed = credentialsSchema.safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  // Counted before the password is checked, in one atomic statement: parallel tries cannot
  // slip more password checks through than the back-off allows.
  if (!(await claimTry([emailKey(email), ipKey(ip)]))) return null;

  const found = await findCredentialsByEmail(email);
  const ok = found ? await verifyPassword(password, found.passwordHash) : await burnPasswordCheck(password);
  if (!found || !ok) return null;
  await Promise.all([clearFailures(emailKey(email)), forgiveTry(ipKey(ip))]);
  return { ...found.user, sessionVersion: found.sessionVersion };
}

/** The client address used as a throttle key: the socket peer unless TRUST_PROXY_HOPS says otherwise. */
export function clientIp(headers: Headers | Record<string, unknown> | undefined): string {
  return clientAddress(headers);
}
