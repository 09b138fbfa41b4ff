import { describe, expect, it } from 'vitest';
import { buildInvitationMail } from './invitation-mail';

describe('invitation mail', () => {
  const mail = buildInvitationMail({
    to: 'dev@shop.test',
    inviterName: 'Rowan <script>',
    channelName: 'Plank & Peg',
    role: 'shop_hand',
    acceptUrl: 'http://127.0.0.1:3000/invite/abc',
    expiresAt: new Date('2026-12-08T00:00:00Z'),
  });
  it('names the channel, the role and the link', () => {
    expect(mail.subject).toBe('Rowan <script> invited you to Plank & Peg on Kerfline');
    expect(mail.text).toContain('as Shop hand');
    expect(mail.text).toContain('http://127.0.0.1:3000/invite/abc');
  });
  it('escapes names in the HTML part', () => {
    expect(mail.html).toContain('Rowan &lt;script&gt;');
    expect(mail.html).toContain('Plank &amp; Peg');
    expect(mail.html).not.toContain('<script>');
  });
});
