import { escapeHtml } from '@/lib/mail/escape';
import type { Mail } from '@/lib/mail/mailer';
import { cameraLabels, framingLabels, type Camera, type Framing } from '@/lib/shots/catalog';

export type MailShot = {
  number: number;
  description: string;
  framing: Framing;
  camera: Camera;
  dueDate: string | null;
  episodeTitle: string;
  segmentTitle: string;
  url: string;
};

const line = (s: MailShot) =>
  `#${s.number} ${s.description} (${framingLabels[s.framing]}, ${cameraLabels[s.camera]}) · ${s.episodeTitle} / ${s.segmentTitle} · due ${s.dueDate ?? 'no date'}`;

const item = (s: MailShot) =>
  `<li><a href="${escapeHtml(s.url)}">#${s.number} ${escapeHtml(s.description)}</a> (${escapeHtml(framingLabels[s.framing])}, ${escapeHtml(
    cameraLabels[s.camera],
  )})<br>${escapeHtml(s.episodeTitle)} / ${escapeHtml(s.segmentTitle)} · due ${escapeHtml(s.dueDate ?? 'no date')}</li>`;

/** One message per burst: what is newly yours, and what is no longer. */
export function buildAssignmentMail(input: { to: string; name: string; channelName: string; added: MailShot[]; removed: MailShot[]; myShotsUrl: string }): Mail {
  const { added, removed } = input;
  const parts = [added.length ? `${added.length} new` : '', removed.length ? `${removed.length} taken off your list` : ''].filter(Boolean);
  const subject = `${input.channelName}: shots for you (${parts.join(', ')})`;
  const text = [
    `Hi ${input.name},`,
    '',
    ...(added.length ? ['Assigned to you:', ...added.map((s) => `- ${line(s)}\n  ${s.url}`), ''] : []),
    ...(removed.length ? ['No longer yours (unassigned, handed to someone else, or deleted):', ...removed.map((s) => `- ${line(s)}`), ''] : []),
    `All your shots: ${input.myShotsUrl}`,
    '',
    'You get this because a Host changed your shots. Turn these e-mails off in your profile.',
  ].join('\n');
  const html = [
    `<p>Hi ${escapeHtml(input.name)},</p>`,
    added.length ? `<p><strong>Assigned to you:</strong></p><ul>${added.map(item).join('')}</ul>` : '',
    removed.length ? `<p><strong>No longer yours</strong> (unassigned, handed to someone else, or deleted):</p><ul>${removed.map(item).join('')}</ul>` : '',
    `<p><a href="${escapeHtml(input.myShotsUrl)}">All your shots</a></p>`,
    '<p>You get this because a Host changed your shots. Turn these e-mails off in your profile.</p>',
  ].join('\n');
  return { to: input.to, subject, text, html };
}
