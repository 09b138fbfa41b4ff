import 'server-only';
import type { Knex } from 'knex';
import { tooManyRequests } from '@/lib/errors';
import { takeHit } from '@/lib/rate-limits/queries';
import { INVITE_MAIL_PER_ADDRESS, INVITE_MAIL_PER_CHANNEL } from '@/lib/rate-limits/rules';

const minutes = (seconds: number) => Math.max(1, Math.ceil(seconds / 60));

/**
 * Counts one invitation mail for the channel and for the address, inside the caller's transaction
 * (so a refused or failed invitation counts nothing). 429 with Retry-After when either is used up.
 */
export async function takeInvitationMail(trx: Knex.Transaction, channelId: string, email: string): Promise<void> {
  const channel = await takeHit([`invite-mail-channel:${channelId}`], INVITE_MAIL_PER_CHANNEL, trx);
  if (!channel.allowed) {
    throw tooManyRequests(
      `This channel has sent ${INVITE_MAIL_PER_CHANNEL.limit} invitation e-mails in the last hour. Try again in ${minutes(channel.retryAfterSeconds)} minutes.`,
      channel.retryAfterSeconds,
    );
  }
  const address = await takeHit([`invite-mail-to:${email.toLowerCase()}`], INVITE_MAIL_PER_ADDRESS, trx);
  if (!address.allowed) {
    throw tooManyRequests(
      `That address has had ${INVITE_MAIL_PER_ADDRESS.limit} invitation e-mails in the last hour. Try again in ${minutes(address.retryAfterSeconds)} minutes.`,
      address.retryAfterSeconds,
    );
  }
}
