import 'server-only';
import { credentialsSchema, type UserDto } from '@/lib/users/schemas';
import { findCredentialsByEmail } from '@/lib/users/queries';
import { burnPasswordCheck, verifyPassword } from './password';
import { clearFailures, emailKey, ipKey, isThrottled, recordFailure } from './throttle-queries';

export const SIGN_IN_FAILED_MESSAGE =
  'That e-mail and password did not match, or there were too many tries. Check them, or wait 15 minutes and try again.';

/** The credentials check behind next-auth. Returns null for every kind of failure, so nothing leaks. */
export async function authorizeCredentials(raw: unknown, ip: string): Promise<UserDto | null> {
  const parsed = credentialsSchema.safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const keys = [emailKey(email), ipKey(ip)];
  if (await isThrottled(keys)) return null;

  const found = await findCredentialsByEmail(email);
  const ok = found ? await verifyPassword(password, found.passwordHash) : await burnPasswordCheck(password);
  if (!found || !ok) {
    await recordFailure(keys);
    return null;
  }
  await clearFailures(emailKey(email));
  return found.user;
}

export function clientIp(headers: Headers | Record<string, unknown> | undefined): string {
  const read = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const v = headers[name];
    return typeof v === 'string' ? v : Array.isArray(v) && typeof v[0] === 'string' ? v[0] : undefined;
  };
  const forwarded = read('x-forwarded-for')?.split(',')[0]?.trim();
  return forwarded || read('x-real-ip') || 'unknown';
}
