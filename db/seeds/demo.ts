import type { Knex } from 'knex';
import { hashPassword } from '../../lib/auth/password';
import { isRole } from '../../lib/auth/policy';
import accounts from './demo-accounts.json';

// Invented demo channel and people (the .test domain is reserved, RFC 2606); no real person or brand.
export const DEMO_CHANNEL = { name: 'Tallowmere Woodshop', slug: 'tallowmere-woodshop' };

export async function seedDemo(trx: Knex.Transaction): Promise<void> {
  const [channel] = await trx('channels')
    .insert({ name: DEMO_CHANNEL.name, slug: DEMO_CHANNEL.slug, speaking_rate_wpm: 150 })
    .returning<{ id: string }[]>('id');
  if (!channel) throw new Error('demo channel insert returned no row');
  for (const account of accounts) {
    if (!isRole(account.role)) throw new Error(`demo account ${account.email} has an unknown role`);
    const [user] = await trx('users')
      .insert({ email: account.email, name: account.name, password_hash: await hashPassword(account.password) })
      .returning<{ id: string }[]>('id');
    if (!user) throw new Error('demo user insert returned no row');
    await trx('memberships').insert({ channel_id: channel.id, user_id: user.id, role: account.role });
  }
}
