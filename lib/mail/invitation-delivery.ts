import 'server-only';
import type { ChannelDto } from '@/lib/channels/schemas';
import { appUrl } from '@/lib/config';
import { buildInvitationMail } from '@/lib/mail/invitation-mail';
import { sendMail } from '@/lib/mail/mailer';
import type { UserDto } from '@/lib/users/schemas';
import { markInvitationSent } from '@/lib/crew/queries';
import type { InvitationDto } from '@/lib/crew/schemas';

export const acceptPath = (token: string) => `/invite/${token}`;

/** Sends the link; a mail failure leaves the invitation in place so the Host can resend. */
export async function deliverInvitation(
  channel: ChannelDto,
  inviter: UserDto,
  invitation: InvitationDto,
  token: string,
): Promise<{ invitation: InvitationDto; delivered: boolean }> {
  const mail = buildInvitationMail({
    to: invitation.email,
    inviterName: inviter.name,
    channelName: channel.name,
    role: invitation.role,
    acceptUrl: `${appUrl()}${acceptPath(token)}`,
    expiresAt: new Date(invitation.expiresAt),
  });
  try {
    await sendMail(mail);
  } catch (err) {
    console.error('[mail] invitation not sent', err);
    return { invitation, delivered: false };
  }
  return { invitation: await markInvitationSent(invitation.id), delivered: true };
}
