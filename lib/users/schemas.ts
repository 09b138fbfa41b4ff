import { z } from 'zod';
import { INVISIBLE_CHARACTERS_MESSAGE, isVisibleName } from '@/lib/text/visible-name';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com.' }));

// bcrypt reads at most 72 bytes (see the bcrypt paper, Provos & Mazières 1999), so longer input is refused, not truncated.
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters.')
  .refine((p) => new TextEncoder().encode(p).length <= 72, 'Use at most 72 bytes (about 72 letters).');

export const personNameSchema = z
  .string({ error: 'Enter a name.' })
  .trim()
  .min(1, 'Enter a name.')
  .max(120, 'Keep the name under 120 characters.')
  .refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE);

export const channelNameSchema = z
  .string({ error: 'Enter a channel name.' })
  .trim()
  .min(2, 'Use at least 2 characters.')
  .max(120, 'Keep the name under 120 characters.')
  .refine(isVisibleName, INVISIBLE_CHARACTERS_MESSAGE);

export const signUpSchema = z.strictObject({
  name: personNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
  channelName: channelNameSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const credentialsSchema = z.object({
  email: emailSchema,
  password: z.string().min(1).max(200),
});

export type UserDto = { id: string; email: string; name: string };

export const updateProfileSchema = z
  .strictObject({
    name: personNameSchema.optional(),
    emailOptOut: z.boolean({ error: 'Say whether to turn shot e-mails off.' }).optional(),
  })
  .refine((v) => v.name !== undefined || v.emailOptOut !== undefined, 'Change at least one field.');
export type UpdateProfileInput = z.infer<typeof updateProfileSchema>;

export type ProfileDto = UserDto & { emailOptOut: boolean };
