import { z } from 'zod';
import type { Role } from '@/lib/auth/policy';
import { channelNameSchema } from '@/lib/users/schemas';

export const channelSlugSchema = z
  .string()
  .min(1)
  .max(80)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Not a channel address.');

export const channelParamsSchema = z.object({ channel: channelSlugSchema });

/** Most reminders before one due date a channel may ask for; more would be noise, not help. Common practice, no published source. */
export const MAX_REMINDER_DAYS = 5;
/** The furthest ahead a reminder may go; the reminder worker reads due dates up to this far (lib/reminders/plan.ts). */
export const MAX_REMINDER_DAYS_AHEAD = 60;

/** Days before an open due date when its reminder e-mail goes; 0 is the due day itself. */
export const reminderDaysSchema = z
  .array(z.number({ error: 'Use whole days, e.g. 3, 1.' }), { error: 'Give the reminder days as a list, e.g. 3, 1.' })
  .min(1, 'Give at least one day (0 is the due day itself).')
  .max(MAX_REMINDER_DAYS, `Give at most ${MAX_REMINDER_DAYS} days.`)
  .superRefine((days, ctx) => {
    if (days.some((d) => !Number.isInteger(d) || d < 0 || d > MAX_REMINDER_DAYS_AHEAD)) {
      ctx.addIssue({ code: 'custom', message: `Use whole days from 0 to ${MAX_REMINDER_DAYS_AHEAD}.` });
    } else if (new Set(days).size !== days.length) {
      ctx.addIssue({ code: 'custom', message: 'Give each day only once.' });
    }
  });

export const channelSettingsSchema = z
  .strictObject({
    name: channelNameSchema.optional(),
    speakingRateWpm: z
      .number({ error: 'Enter words per minute as a number.' })
      .int('Use a whole number.')
      .min(60, 'Use at least 60 words per minute.')
      .max(300, 'Use at most 300 words per minute.')
      .optional(),
    reminderDays: reminderDaysSchema.optional(),
  })
  .refine((v) => v.name !== undefined || v.speakingRateWpm !== undefined || v.reminderDays !== undefined, 'Change at least one setting.');
export type ChannelSettingsInput = z.infer<typeof channelSettingsSchema>;

/** `reminderDays`: days before a due date when reminders go, largest first. */
export type ChannelDto = { id: string; slug: string; name: string; speakingRateWpm: number; reminderDays: number[] };
export type ChannelWithRoleDto = ChannelDto & { role: Role };

export const newChannelSchema = z.strictObject({ name: channelNameSchema });
