import 'server-only';
import { db } from '@/db/client';
import type { UserDto } from '@/lib/users/schemas';

/** What a session token says about itself (lib/auth/options.ts puts it there at sign-in). */
export type SessionClaims = { userId: string; version: number; sid: string | null };

/**
 * The user behind a session token, or null when the token's session has ended: signed out
 * (its sid is revoked) or signed out everywhere (the user's session_version moved on). One query.
 */
export async function findSessionUser(claims: SessionClaims): Promise<UserDto | null> {
  const query = db('users').where({ id: claims.userId, session_version: claims.version });
  if (claims.sid) query.whereNotExists(db('revoked_sessions').where({ sid: claims.sid }).select(db.raw('1')));
  const row: UserDto | undefined = await query.first(['id', 'email', 'name']);
  return row ? { id: row.id, email: row.email, name: row.name } : null;
}

/** Ends one session: its token stops working on every request, though the cookie may linger. */
export async function revokeSession(userId: string, sid: string, expiresAt: Date): Promise<void> {
  await db('revoked_sessions').insert({ sid, user_id: userId, expires_at: expiresAt }).onConflict('sid').ignore();
  // A revoked token past its expiry is refused by next-auth anyway; its row is dead weight.
  await db('revoked_sessions').where('expires_at', '<', db.fn.now()).delete();
}

/** "Sign out everywhere": every token carrying the old version stops working. */
export async function endAllSessions(userId: string): Promise<void> {
  await db('users').where({ id: userId }).increment('session_version', 1);
}
