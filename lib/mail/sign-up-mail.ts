import type { Mail } from './mailer';
import { escapeHtml } from './escape';

/** To a new account: the channel is ready. Sent so both sign-up outcomes send exactly one mail. */
export function buildWelcomeMail(input: { to: string; name: string; channelName: string; channelUrl: string }): Mail {
  const subject = `Your Kerfline channel ${input.channelName} is ready`;
  const text = [
    `Hello ${input.name},`,
    '',
    `Your channel ${input.channelName} is ready: ${input.channelUrl}`,
    '',
    'If you did not create it, reply to this message and we will remove the account.',
  ].join('\n');
  const html = `<p>Hello ${escapeHtml(input.name)},</p>
<p>Your channel <strong>${escapeHtml(input.channelName)}</strong> is ready: <a href="${escapeHtml(input.channelUrl)}">open it</a>.</p>
<p>If you did not create it, reply to this message and we will remove the account.</p>`;
  return { to: input.to, subject, text, html };
}

/** To an existing account: someone tried to sign up with this address. No account details in it. */
export function buildSignUpAttemptMail(input: { to: string; signInUrl: string }): Mail {
  const subject = 'Someone tried to create a Kerfline account with your e-mail';
  const text = [
    'Someone tried to create a new Kerfline account with this e-mail address, which already has one.',
    'Nothing was changed and no account was made.',
    '',
    `If it was you, sign in instead: ${input.signInUrl}`,
    'If it was not you, you can ignore this message.',
  ].join('\n');
  const html = `<p>Someone tried to create a new Kerfline account with this e-mail address, which already has one.
Nothing was changed and no account was made.</p>
<p>If it was you, <a href="${escapeHtml(input.signInUrl)}">sign in instead</a>. If it was not you, you can ignore this message.</p>`;
  return { to: input.to, subject, text, html };
}
