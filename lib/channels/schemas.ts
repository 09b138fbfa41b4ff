import { z } from 'zod';
import type { Role } from '@/lib/auth/policy';
import { channelNameSchema } from '@/lib/users/schemas';

export const channelSlugSchema = z
  .string()
  .min(1)
  .max(80)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Not a channel address.');

export const channelParamsSchema = z.object({ channel: channelSlugSchema });

export const channelSettingsSchema = z
  .strictObject({
    name: channelNameSchema.optional(),
    speakingRateWpm: z
      .number({ error: 'Enter words per minute as a number.' })
      .int('Use a whole number.')
      .min(60, 'Use at least 60 words per minute.')
      .max(300, 'Use at most 300 words per minute.')
      .optional(),
  })
  .refine((v) => v.name !== undefined || v.speakingRateWpm !== undefined, 'Change at least one setting.');
export type ChannelSettingsInput = z.infer<typeof channelSettingsSchema>;

export type ChannelDto = { id: string; slug: string; name: string; speakingRateWpm: number };
export type ChannelWithRoleDto = ChannelDto & { role: Role };

export const newChannelSchema = z.strictObject({ name: channelNameSchema });
