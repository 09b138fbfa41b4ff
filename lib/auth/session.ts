import 'server-only';
import { getServerSession } from 'next-auth';
import { getToken } from 'next-auth/jwt';
import { forbidden, notFound, redirect } from 'next/navigation';
import type { NextRequest } from 'next/server';
import { findMembership, type Membership } from '@/lib/channels/queries';
import { config } from '@/lib/config';
import { findUserById } from '@/lib/users/queries';
import type { UserDto } from '@/lib/users/schemas';
import { authOptions } from './options';
import { can, type Capability } from './policy';

export async function getUserFromRequest(req: NextRequest): Promise<UserDto | null> {
  const token = await getToken({ req, secret: config().NEXTAUTH_SECRET });
  return token?.sub ? findUserById(token.sub) : null;
}

export async function getCurrentUser(): Promise<UserDto | null> {
  const session = await getServerSession(authOptions);
  return session?.user.id ? findUserById(session.user.id) : null;
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
