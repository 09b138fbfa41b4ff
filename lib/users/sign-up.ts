import 'server-only';
import { appUrl } from '@/lib/config';
import { sendMail, type Mail } from '@/lib/mail/mailer';
import { buildSignUpAttemptMail, buildWelcomeMail } from '@/lib/mail/sign-up-mail';
import { takeHit } from '@/lib/rate-limits/queries';
import { SIGN_UP_MAIL_PER_ADDRESS } from '@/lib/rate-limits/rules';
import type { SignUpInput } from './schemas';
import { signUp } from './queries';

/** The one answer to every valid sign-up, so it cannot tell anyone whether an address has an account. */
export const SIGN_UP_ANSWER =
  'Thanks. We sent a message to that address. If it was new to Kerfline, your channel is ready: you are being signed in.';

/**
 * Sign-up that does not reveal accounts (issue 12 item 12): a new address gets an account, a
 * channel and a welcome mail; a known one gets a mail saying someone tried. Both answer the same.
 * Mail to one address is rate-limited, so the form cannot be used to flood someone's inbox.
 */
export async function signUpWithoutDisclosure(input: SignUpInput): Promise<{ message: string }> {
  const made = await signUp(input);
  const mail: Mail = made
    ? buildWelcomeMail({ to: input.email, name: made.user.name, channelName: made.channel.name, channelUrl: `${appUrl()}/c/${made.channel.slug}` })
    : buildSignUpAttemptMail({ to: input.email, signInUrl: `${appUrl()}/sign-in` });
  const quota = await takeHit([`sign-up-mail-to:${input.email}`], SIGN_UP_MAIL_PER_ADDRESS);
  if (quota.allowed) {
    // A mail failure must not change the answer either; it is logged for whoever runs the server.
    await sendMail(mail).catch((err: unknown) => console.error('[mail] sign-up mail not sent', err));
  }
  return { message: SIGN_UP_ANSWER };
}
