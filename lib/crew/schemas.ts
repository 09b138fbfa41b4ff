import { z } from 'zod';
import { roles } from '@/lib/auth/policy';
import { channelSlugSchema } from '@/lib/channels/schemas';
import { emailSchema, newPasswordSchema, personNameSchema } from '@/lib/users/schemas';

export const roleSchema = z.enum(roles, { error: 'Choose Host, Shop hand or Editor.' });

export const inviteSchema = z.strictObject({ email: emailSchema, role: roleSchema });
export type InviteInput = z.infer<typeof inviteSchema>;

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export const memberParamsSchema = z.object({ channel: channelSlugSchema, userId: z.uuid() });
export const invitationParamsSchema = z.object({ channel: channelSlugSchema, invitationId: z.uuid() });
export const tokenParamsSchema = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/) });

export const acceptAsNewSchema = z.strictObject({ name: personNameSchema, password: newPasswordSchema });
// Both fields for a new account, neither for someone already signed in.
export const acceptSchema = z
  .strictObject({ name: personNameSchema.optional(), password: newPasswordSchema.optional() })
  .superRefine((v, ctx) => {
    if (v.password !== undefined && v.name === undefined) ctx.addIssue({ code: 'custom', path: ['name'], message: 'Enter your name.' });
    if (v.name !== undefined && v.password === undefined) ctx.addIssue({ code: 'custom', path: ['password'], message: 'Choose a password.' });
  });

export type CrewMemberDto = {
  userId: string;
  name: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  joinedAt: string;
};

export type InvitationDto = {
  id: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  expiresAt: string;
  sentAt: string | null;
  expired: boolean;
};

export type InvitationStatus = 'open' | 'expired' | 'revoked' | 'accepted' | 'unknown';

export type InvitationLookupDto = {
  status: InvitationStatus;
  email?: string;
  role?: z.infer<typeof roleSchema>;
  channelName?: string;
  channelSlug?: string;
  accountExists?: boolean;
};
