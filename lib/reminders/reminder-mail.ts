import type { Mail } from '@/lib/mail/mailer';
import { escapeHtml } from '@/lib/mail/escape';
import { dueDateLabels, type DueDateKind } from '@/lib/sponsors/schemas';
import { OVERDUE } from './plan';

export type ReminderMailInput = {
  to: string;
  name: string;
  channelName: string;
  sponsorName: string;
  episodeTitle: string;
  kind: DueDateKind;
  dueOn: string;
  threshold: number;
  dealUrl: string;
};

const when = (threshold: number) => (threshold === OVERDUE ? 'is overdue' : threshold === 0 ? 'is due today' : threshold === 1 ? 'is due within a day' : `is due within ${threshold} days`);

/** One reminder: which due date, for which sponsor and episode, and a link to the deal. */
export function buildReminderMail(r: ReminderMailInput): Mail {
  const what = `${dueDateLabels[r.kind]} for ${r.sponsorName}`;
  const subject = `${what} ${when(r.threshold)} (${r.dueOn})`;
  const text = [`Hello ${r.name},`, '', `${what} ${when(r.threshold)}: ${r.dueOn}.`, `Episode: ${r.episodeTitle} (${r.channelName})`, '', `Open the deal: ${r.dealUrl}`, '', 'Kerfline'].join('\n');
  const html = `<p>Hello ${escapeHtml(r.name)},</p><p><strong>${escapeHtml(what)}</strong> ${when(r.threshold)}: <code>${r.dueOn}</code>.<br>Episode: ${escapeHtml(r.episodeTitle)} (${escapeHtml(r.channelName)})</p><p><a href="${escapeHtml(r.dealUrl)}">Open the deal</a></p>`;
  return { to: r.to, subject, text, html };
}
