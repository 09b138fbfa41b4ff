import { escapeHtml } from '@/lib/mail/escape';
import type { Mail } from '@/lib/mail/mailer';

export function buildApprovalMail(input: { to: string; hostName: string; channelName: string; sponsorName: string; episodeTitle: string; url: string; expiresAt: Date }): Mail {
  const until = input.expiresAt.toUTCString();
  const subject = `Please review the ${input.sponsorName} read for “${input.episodeTitle}”`;
  const text = [
    `${input.hostName} of ${input.channelName} asks you to review the sponsor read for “${input.episodeTitle}”.`,
    '',
    `Read it and approve or request changes: ${input.url}`,
    '',
    `The link works until ${until}. No account is needed.`,
  ].join('\n');
  const html = `<p>${escapeHtml(input.hostName)} of <strong>${escapeHtml(input.channelName)}</strong> asks you to review the sponsor read for “${escapeHtml(input.episodeTitle)}”.</p>
<p><a href="${escapeHtml(input.url)}">Read it and approve or request changes</a></p>
<p>The link works until ${escapeHtml(until)}. No account is needed.</p>`;
  return { to: input.to, subject, text, html };
}
