import { describe, expect, it } from 'vitest';
import { buildAssignmentMail, type MailShot } from './assignment-mail';

const shot = (n: number, description: string): MailShot => ({
  number: n,
  description,
  framing: 'close_up',
  camera: 'b_cam',
  dueDate: '2027-01-16',
  episodeTitle: 'One <Stool>',
  segmentTitle: 'Starter',
  url: `https://k.test/s#shot-${n}`,
});

describe('assignment mail', () => {
  it('lists new and removed shots with episode, segment, framing, due date and link, escaped in HTML', () => {
    const mail = buildAssignmentMail({ to: 'a@b.test', name: 'Dev', channelName: 'Shop', added: [shot(1, 'Glue & clamp')], removed: [shot(2, 'Old one')], myShotsUrl: 'https://k.test/mine' });
    expect(mail.subject).toBe('Shop: shots for you (1 new, 1 taken off your list)');
    expect(mail.text).toContain('#1 Glue & clamp (Close-up, B cam) · One <Stool> / Starter · due 2027-01-16');
    expect(mail.text).toContain('https://k.test/s#shot-1');
    expect(mail.text).toMatch(/No longer yours[\s\S]*#2 Old one/);
    expect(mail.html).toContain('One &lt;Stool&gt;');
    expect(mail.html).toContain('Glue &amp; clamp');
  });
});
