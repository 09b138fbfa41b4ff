import { escapeHtml } from '@/lib/mail/escape';
import type { Mail } from '@/lib/mail/mailer';

/** The one e-mail an Editor gets per new handoff version. */
export function buildHandoffMail(input: { to: string; channelName: string; episodeTitle: string; version: number; lockedBy: string; note: string; url: string }): Mail {
  const subject = `v${input.version} of “${input.episodeTitle}” is locked for edit`;
  const note = input.note.trim();
  const text = [
    `${input.lockedBy} locked version ${input.version} of “${input.episodeTitle}” (${input.channelName}) for edit.`,
    ...(note ? ['', `Note from the host: ${note}`] : []),
    '',
    `Open the handoff: ${input.url}`,
  ].join('\n');
  const html = `<p>${escapeHtml(input.lockedBy)} locked version ${input.version} of <strong>${escapeHtml(input.episodeTitle)}</strong> (${escapeHtml(input.channelName)}) for edit.</p>
${note ? `<p>Note from the host: ${escapeHtml(note)}</p>\n` : ''}<p><a href="${escapeHtml(input.url)}">Open the handoff</a></p>`;
  return { to: input.to, subject, text, html };
}
