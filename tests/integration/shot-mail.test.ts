import { describe, expect, it } from 'vitest';
import * as shotMailRoute from '@/app/api/channels/[channel]/shot-mail/route';
import * as bulkRoute from '@/app/api/channels/[channel]/segments/[segmentId]/shots/bulk/route';
import * as shotRoute from '@/app/api/channels/[channel]/shots/[shotId]/route';
import { db } from '@/db/client';
import { sendShotMail } from '@/lib/mail/assignment-queries';
import type { ShotDto } from '@/lib/shots/schemas';
import { makeOutlinedEpisode } from './episode-fixtures';
import { mailAfterEverythingSent as mailsTo } from '../support/mail-catcher';
import { call, makeCrew } from './helpers';

describe('assignment e-mail', () => {
  it('sends one message per burst with the right shots, then only the difference', async () => {
    const c = await makeCrew();
    const { segments } = await makeOutlinedEpisode(c);
    const build = segments.find((s) => s.kind === 'build')!;
    const params = { channel: c.channel.slug, segmentId: build.id };
    const add = await call(bulkRoute.POST, 'POST', {
      as: c.host,
      params,
      body: { text: 'CU: glue squeeze-out\nWide: clamp up\nOverhead / Top cam: layout', assigneeId: c.shopHand.id, dueDate: '2027-01-16' },
    });
    expect(add.status).toBe(201);
    const [glue, clamp, layout] = (add.json as { shots: ShotDto[] }).shots;
    const patch = (shotId: string, body: object) => call(shotRoute.PATCH, 'PATCH', { as: c.host, params: { channel: c.channel.slug, shotId }, body });
    // Within the same burst: one shot handed to the host, one taken back; neither is news to the shop hand.
    expect((await patch(clamp!.id, { assigneeId: c.host.id })).status).toBe(200);
    expect((await patch(layout!.id, { assigneeId: null })).status).toBe(200);

    // Nothing is due yet: the burst waits for more changes.
    await sendShotMail({ channelId: c.channel.id });
    expect(await mailsTo(c.shopHand.email)).toHaveLength(0);

    const flush = await call(shotMailRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug } });
    expect(flush.status).toBe(200);
    expect(flush.json).toEqual({ sent: 2, failed: 0 });
    const [mail, ...more] = await mailsTo(c.shopHand.email);
    expect(more).toHaveLength(0);
    expect(mail!.subject).toContain('1 new');
    expect(mail!.text).toContain('#1 glue squeeze-out (Close-up, A cam) · Walnut step stool / ');
    expect(mail!.text).toContain('due 2027-01-16');
    expect(mail!.text).toContain(`/segments/${build.id}#shot-${glue!.id}`);
    expect(mail!.text).not.toContain('clamp up');
    expect(mail!.text).not.toContain('layout');
    const hostMail = await mailsTo(c.host.email);
    expect(hostMail).toHaveLength(1);
    expect(hostMail[0]!.text).toContain('clamp up');

    // Flushing again sends nothing: the burst is closed.
    expect((await call(shotMailRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug } })).json).toEqual({ sent: 0, failed: 0 });
    expect(await mailsTo(c.shopHand.email)).toHaveLength(1);

    // The next burst says what changed since: the glue shot went to the host.
    expect((await patch(glue!.id, { assigneeId: c.host.id })).status).toBe(200);
    await db('shot_mail_bursts').where({ channel_id: c.channel.id }).update({ due_at: db.raw(`now() - interval '1 second'`) });
    await sendShotMail({ channelId: c.channel.id });
    const second = await mailsTo(c.shopHand.email);
    expect(second).toHaveLength(2);
    const latest = second.find((m) => m.subject.includes('taken off'))!;
    expect(latest.text).toMatch(/No longer yours[\s\S]*glue squeeze-out/);
  });

  it('sends nothing to someone who opted out, and does not save it up for later', async () => {
    const c = await makeCrew();
    await db('users').where({ id: c.shopHand.id }).update({ email_opt_out: true });
    const { segments } = await makeOutlinedEpisode(c);
    const build = segments.find((s) => s.kind === 'build')!;
    await call(bulkRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug, segmentId: build.id }, body: { text: 'Wide: the shop', assigneeId: c.shopHand.id } });
    expect((await call(shotMailRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug } })).json).toEqual({ sent: 0, failed: 0 });
    await db('users').where({ id: c.shopHand.id }).update({ email_opt_out: false });
    expect((await call(shotMailRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug } })).json).toEqual({ sent: 0, failed: 0 });
    expect(await mailsTo(c.shopHand.email)).toHaveLength(0);
  });

  it('sends nothing to someone who has left the crew', async () => {
    const c = await makeCrew();
    const { segments } = await makeOutlinedEpisode(c);
    const build = segments.find((s) => s.kind === 'build')!;
    await call(bulkRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug, segmentId: build.id }, body: { text: 'Wide: the shop', assigneeId: c.shopHand.id } });
    await db('memberships').where({ channel_id: c.channel.id, user_id: c.shopHand.id }).delete();
    expect((await call(shotMailRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug } })).json).toEqual({ sent: 0, failed: 0 });
    expect(await mailsTo(c.shopHand.email)).toHaveLength(0);
  });
});
