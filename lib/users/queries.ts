import 'server-only';
import { db } from '@/db/client';
import { hashPassword } from '@/lib/auth/password';
import { createChannelWithHost } from '@/lib/channels/queries';
import type { ChannelDto } from '@/lib/channels/schemas';
import { notFound } from '@/lib/errors';
import type { ProfileDto, SignUpInput, UpdateProfileInput, UserDto } from './schemas';

type UserRow = { id: string; email: string; name: string; password_hash: string; session_version: number };

const toUserDto = (row: Pick<UserRow, 'id' | 'email' | 'name'>): UserDto => ({ id: row.id, email: row.email, name: row.name });

export async function findUserById(id: string): Promise<UserDto | null> {
  const row: UserRow | undefined = await db('users').where({ id }).first(['id', 'email', 'name']);
  return row ? toUserDto(row) : null;
}

export async function findUserByEmail(email: string): Promise<UserDto | null> {
  const row: UserRow | undefined = await db('users').where({ email }).first(['id', 'email', 'name']);
  return row ? toUserDto(row) : null;
}

/** Only for checking a password; the hash never leaves lib/auth. */
export async function findCredentialsByEmail(
  email: string,
): Promise<{ user: UserDto; passwordHash: string; sessionVersion: number } | null> {
  const row: UserRow | undefined = await db('users').where({ email }).first(['id', 'email', 'name', 'password_hash', 'session_version']);
  return row ? { user: toUserDto(row), passwordHash: row.password_hash, sessionVersion: row.session_version } : null;
}

/**
 * Creates the user, their channel and Host membership; null when the address already has an
 * account. The password is hashed on both paths, so the answer takes as long either way.
 */
export async function signUp(input: SignUpInput): Promise<{ user: UserDto; channel: ChannelDto } | null> {
  const existing = await db('users').where({ email: input.email }).first('id');
  const passwordHash = await hashPassword(input.password);
  if (existing) return null;
  try {
    return await db.transaction(async (trx) => {
      const [row] = await trx('users')
        .insert({ email: input.email, name: input.name, password_hash: passwordHash })
        .returning<UserRow[]>(['id', 'email', 'name']);
      if (!row) throw new Error('user insert returned no row');
      const channel = await createChannelWithHost(trx, input.channelName, row.id);
      return { user: toUserDto(row), channel };
    });
  } catch (err) {
    // Two sign-ups for one new address at once: the second finds it taken, as above.
    if ((err as { code?: unknown }).code === '23505' && /email/.test(String((err as { constraint?: unknown }).constraint))) return null;
    throw err;
  }
}

type ProfileRow = { id: string; email: string; name: string; email_opt_out: boolean };
const toProfileDto = (r: ProfileRow): ProfileDto => ({ ...toUserDto(r), emailOptOut: r.email_opt_out });

export async function getProfile(userId: string): Promise<ProfileDto> {
  const row: ProfileRow | undefined = await db('users').where({ id: userId }).first(['id', 'email', 'name', 'email_opt_out']);
  if (!row) throw notFound('Your account');
  return toProfileDto(row);
}

export async function updateProfile(userId: string, input: UpdateProfileInput): Promise<ProfileDto> {
  const [row] = await db('users')
    .where({ id: userId })
    .update({
      ...(input.name !== undefined && { name: input.name }),
      ...(input.emailOptOut !== undefined && { email_opt_out: input.emailOptOut }),
    })
    .returning<ProfileRow[]>(['id', 'email', 'name', 'email_opt_out']);
  if (!row) throw notFound('Your account');
  return toProfileDto(row);
}
