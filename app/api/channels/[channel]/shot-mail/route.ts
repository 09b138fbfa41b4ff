import { route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { countOpenBursts, sendShotMail } from '@/lib/mail/assignment-queries';

export const GET = route({ params: channelParamsSchema, channel: 'shots.edit' }, async ({ member }) => ({
  waiting: await countOpenBursts(member.channel.id),
}));

/** "Send to crew": every open burst of the channel goes now instead of when it is due. */
export const POST = route({ params: channelParamsSchema, channel: 'shots.edit' }, async ({ member }) => sendShotMail({ channelId: member.channel.id, now: true }));
