import { route } from '@/lib/api/handler';
import { channelParamsSchema } from '@/lib/channels/schemas';
import { getCutSettings, updateCutSettings } from '@/lib/stock/queries';
import { cutSettingsSchema } from '@/lib/stock/schemas';

export const GET = route({ params: channelParamsSchema, channel: 'cutlist.read' }, async ({ member }) => ({ settings: await getCutSettings(member.channel.id) }));

export const PATCH = route({ params: channelParamsSchema, body: cutSettingsSchema, channel: 'cutlist.edit' }, async ({ member, body }) => ({
  settings: await updateCutSettings(member.channel.id, body),
}));
