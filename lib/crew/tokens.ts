import { createHash, randomBytes } from 'node:crypto';

// 32 random bytes: the same strength as the session secret; only the SHA-256 is stored.
export function generateInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}

export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export const INVITATION_TTL_DAYS = 7;

export function invitationExpiry(from: Date = new Date()): Date {
  return new Date(from.getTime() + INVITATION_TTL_DAYS * 24 * 60 * 60 * 1000);
}
