import { roleLabels, type Role } from '@/lib/auth/policy';
import type { Mail } from './mailer';
import { escapeHtml } from './escape';

export function buildInvitationMail(input: {
  to: string;
  inviterName: string;
  channelName: string;
  role: Role;
  acceptUrl: string;
  expiresAt: Date;
}): Mail {
  const role = roleLabels[input.role];
  const until = input.expiresAt.toUTCString();
  const subject = `${input.inviterName} invited you to ${input.channelName} on Kerfline`;
  const text = [
    `${input.inviterName} invited you to join ${input.channelName} on Kerfline as ${role}.`,
    '',
    `Accept the invitation: ${input.acceptUrl}`,
    '',
    `The link works once and until ${until}. If you did not expect this, you can ignore it.`,
  ].join('\n');
  const html = `<p>${escapeHtml(input.inviterName)} invited you to join <strong>${escapeHtml(input.channelName)}</strong> on Kerfline as ${escapeHtml(role)}.</p>
<p><a href="${escapeHtml(input.acceptUrl)}">Accept the invitation</a></p>
<p>The link works once and until ${escapeHtml(until)}. If you did not expect this, you can ignore it.</p>`;
  return { to: input.to, subject, text, html };
}
