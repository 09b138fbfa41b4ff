import 'server-only';
import { getToken, type JWT } from 'next-auth/jwt';
import { cookies, headers } from 'next/headers';
import { forbidden, notFound, redirect } from 'next/navigation';
import type { NextRequest } from 'next/server';
import { findMembership, type Membership } from '@/lib/channels/queries';
import { config } from '@/lib/config';
import type { UserDto } from '@/lib/users/schemas';
import { can, type Capability } from './policy';
import { findSessionUser } from './session-queries';

/** A valid token whose session has not ended (sign-out, "sign out everywhere"); checked on every request. */
async function userFromToken(token: JWT | null): Promise<UserDto | null> {
  if (!token?.sub) return null;
  // Tokens from before session versions existed carry none; they belong to version 0.
  const version = typeof token.sv === 'number' ? token.sv : 0;
  return findSessionUser({ userId: token.sub, version, sid: typeof token.sid === 'string' ? token.sid : null });
}

/** For route handlers and tus hooks. */
export async function getUserFromRequest(req: NextRequest): Promise<UserDto | null> {
  return userFromToken(await getToken({ req, secret: config().NEXTAUTH_SECRET }));
}

/** For pages and layouts: the same check, reading the request's cookies. */
export async function getCurrentUser(): Promise<UserDto | null> {
  const req = { cookies: await cookies(), headers: await headers() };
  return userFromToken(await getToken({ req: req as unknown as NextRequest, secret: config().NEXTAUTH_SECRET }));
}

/** For pages: sign-in redirect when signed out. */
export async function requireUser(): Promise<UserDto> {
  const user = await getCurrentUser();
  if (!user) redirect('/sign-in');
  return user;
}

/** For pages under /c/[channel]: 404 for a channel the user is not crew of, 403 for a role without the capability. */
export async function requireMember(slug: string, capability?: Capability): Promise<Membership & { user: UserDto }> {
  const user = await requireUser();
  const membership = await findMembership(slug, user.id);
  if (!membership) notFound();
  if (capability && !can(membership.role, capability)) forbidden();
  return { ...membership, user };
}
