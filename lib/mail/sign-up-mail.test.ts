import { describe, expect, it } from 'vitest';
import { buildSignUpAttemptMail, buildWelcomeMail } from './sign-up-mail';

describe('sign-up mails', () => {
  it('welcomes a new account with its channel link, escaping names in HTML', () => {
    const mail = buildWelcomeMail({ to: 'a@b.test', name: 'Ada <Plank>', channelName: 'Plank & Peg', channelUrl: 'https://k.test/c/plank-peg' });
    expect(mail.subject).toContain('Plank & Peg');
    expect(mail.text).toContain('https://k.test/c/plank-peg');
    expect(mail.html).toContain('Ada &lt;Plank&gt;');
    expect(mail.html).toContain('Plank &amp; Peg');
  });

  it('tells an existing account that someone tried, and gives nothing away but a sign-in link', () => {
    const mail = buildSignUpAttemptMail({ to: 'a@b.test', signInUrl: 'https://k.test/sign-in' });
    expect(mail.text).toContain('https://k.test/sign-in');
    expect(mail.text).toMatch(/no account was made/);
  });
});
