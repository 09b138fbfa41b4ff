import { route } from '@/lib/api/handler';
import { updateChannelSettings } from '@/lib/channels/queries';
import { channelParamsSchema, channelSettingsSchema } from '@/lib/channels/schemas';

export const GET = route({ params: channelParamsSchema, channel: 'member' }, async ({ member }) => ({
  channel: member.channel,
  role: member.role,
}));

export const PATCH = route(
  { params: channelParamsSchema, body: channelSettingsSchema, channel: 'channel.settings' },
  async ({ member, body }) => ({ channel: await updateChannelSettings(member.channel.id, body) }),
);
