import type { Knex } from 'knex';
import { insertHandoffVersion } from '../../lib/handoffs/lock-queries';

/** The demo episode locked as v1 by the demo Host, so the Editor's handoff page has something to open. */
export async function seedDemoHandoff(trx: Knex.Transaction, channelId: string): Promise<void> {
  const episode: { id: string } | undefined = await trx('episodes').where({ channel_id: channelId }).orderBy('created_at').first('id');
  const host: { id: string; name: string } | undefined = await trx('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.channel_id': channelId, 'm.role': 'host' })
    .orderBy('u.created_at')
    .first('u.id', 'u.name');
  const channel: { speaking_rate_wpm: number } = await trx('channels').where({ id: channelId }).first('speaking_rate_wpm');
  if (!episode || !host) return;
  await insertHandoffVersion(trx, {
    channelId,
    episodeId: episode.id,
    wordsPerMinute: channel.speaking_rate_wpm,
    lockedBy: host,
    note: 'First assembly: the Starter build is complete, the Advanced build still needs its glue-up shots.',
  });
}
