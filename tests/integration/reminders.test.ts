import { describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { sendDueReminders } from '@/lib/reminders/queries';
import { updateDeliverable } from '@/lib/sponsors/deliverable-queries';
import { updateDueDate } from '@/lib/sponsors/due-date-queries';
import * as channelRoute from '@/app/api/channels/[channel]/route';
import { call, makeCrew } from './helpers';
import { mailAfterEverythingSent, waitForMail } from '../support/mail-catcher';
import { makeDeal } from './sponsor-fixtures';

// The fixture's due dates: Script due 2027-03-01, Go-live 2027-03-20, Payment due 2027-04-19.
const at = (day: string) => new Date(`${day}T09:00:00Z`);

async function sentRows(dueDateIds: string[]) {
  return db('reminder_sends').whereIn('due_date_id', dueDateIds).orderBy('id').select('user_id', 'threshold', 'due_on');
}

async function dueDateIds(deliverableId: string) {
  return (await db('due_dates').where({ deliverable_id: deliverableId }).pluck('id')) as string[];
}

describe('due date reminders', () => {
  it('go once per due date, person and threshold, even with two workers polling at the same moment', async () => {
    const c = await makeCrew();
    const { deliverable } = await makeDeal(c);
    await updateDeliverable(c.channel.id, deliverable.id, { ownerId: c.editor.id }, c.host.id);
    const ids = await dueDateIds(deliverable.id);
    const opts = { channelId: c.channel.id };

    // Three days before Script due: the Host and the owner, one mail each.
    const [a, b] = await Promise.all([sendDueReminders(at('2027-02-26'), opts), sendDueReminders(at('2027-02-26'), opts)]);
    expect(a.sent + b.sent).toBe(2);
    expect((await sendDueReminders(at('2027-02-27'), opts)).sent).toBe(0);
    const first = await waitForMail(c.host.email);
    expect(first).toHaveLength(1);
    expect(first[0]!.subject).toBe('Script due for Bramblewick Abrasives is due within 3 days (2027-03-01)');
    expect(first[0]!.text).toContain(`/c/${c.channel.slug}/sponsors/`);
    expect(await waitForMail(c.editor.email)).toHaveLength(1);
    // The shop hand holds nothing here and hears nothing.
    expect(await mailAfterEverythingSent(c.shopHand.email)).toHaveLength(0);

    // The clock moves on: one day before, then overdue; each once, however often the workers poll.
    for (const day of ['2027-02-28', '2027-02-28', '2027-03-02', '2027-03-03']) {
      await Promise.all([sendDueReminders(at(day), opts), sendDueReminders(at(day), opts)]);
    }
    const rows = await sentRows(ids);
    expect(rows.filter((r) => r.user_id === c.host.id).map((r) => [r.threshold, r.due_on])).toEqual([
      [3, '2027-03-01'],
      [1, '2027-03-01'],
      [-1, '2027-03-01'],
    ]);
    expect(await waitForMail(c.host.email, { atLeast: 3 })).toHaveLength(3);
  });

  it('a moved due date is reminded anew for its new date, and a done one not at all', async () => {
    const c = await makeCrew();
    const { deliverable } = await makeDeal(c);
    const opts = { channelId: c.channel.id };
    const ids = await dueDateIds(deliverable.id);
    expect((await sendDueReminders(at('2027-02-27'), opts)).sent).toBe(1);
    // Moved a week later: nothing is pending for the old date, and the new one gets its own reminders.
    await updateDueDate(c.channel.id, deliverable.id, 'script_due', { dueOn: '2027-03-08' }, c.host.id);
    expect((await sendDueReminders(at('2027-03-02'), opts)).sent).toBe(0);
    expect((await sendDueReminders(at('2027-03-05'), opts)).sent).toBe(1);
    // Done: no overdue reminder after the date passes.
    await updateDueDate(c.channel.id, deliverable.id, 'script_due', { done: true }, c.host.id);
    await updateDueDate(c.channel.id, deliverable.id, 'go_live', { done: true }, c.host.id);
    expect((await sendDueReminders(at('2027-03-20'), opts)).sent).toBe(0);
    expect((await sentRows(ids)).map((r) => [r.threshold, r.due_on])).toEqual([
      [3, '2027-03-01'],
      [3, '2027-03-08'],
    ]);
  });

  it('honours the channel setting for how many days ahead', async () => {
    const c = await makeCrew();
    await db('channels').where({ id: c.channel.id }).update({ reminder_days: JSON.stringify([7]) });
    await makeDeal(c);
    expect((await sendDueReminders(at('2027-02-21'), { channelId: c.channel.id })).sent).toBe(0);
    expect((await sendDueReminders(at('2027-02-22'), { channelId: c.channel.id })).sent).toBe(1);
  });

  it('takes the days a Host sets in Settings, refuses bad lists with the field named, and lets no one else change them', async () => {
    const c = await makeCrew();
    const patch = (as: typeof c.host, reminderDays: unknown) => call(channelRoute.PATCH, 'PATCH', { as, params: { channel: c.channel.slug }, body: { reminderDays } });
    const shown = await call(channelRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug } });
    expect(shown.json.channel).toMatchObject({ reminderDays: [3, 1] });

    const saved = await patch(c.host, [10, 2]);
    expect(saved.status).toBe(200);
    expect(saved.json.channel).toMatchObject({ reminderDays: [10, 2] });
    for (const [bad, message] of [
      [[], 'Give at least one day (0 is the due day itself).'],
      [[1, 2, 3, 4, 5, 6], 'Give at most 5 days.'],
      [[61], 'Use whole days from 0 to 60.'],
      [[2.5], 'Use whole days from 0 to 60.'],
      [[4, 4], 'Give each day only once.'],
    ] as const) {
      const res = await patch(c.host, bad);
      expect(res.status, JSON.stringify(bad)).toBe(400);
      expect(res.json.error?.fields).toEqual({ reminderDays: message });
    }
    expect((await patch(c.editor, [1])).status).toBe(403);
    expect((await patch(c.shopHand, [1])).status).toBe(403);
    const stored: { reminder_days: unknown } = await db('channels').where({ id: c.channel.id }).first('reminder_days');
    expect(stored.reminder_days).toEqual([10, 2]);

    // The worker follows the saved setting: Script due 2027-03-01 is reminded ten days ahead, not three.
    await makeDeal(c);
    expect((await sendDueReminders(at('2027-02-18'), { channelId: c.channel.id })).sent).toBe(0);
    expect((await sendDueReminders(at('2027-02-19'), { channelId: c.channel.id })).sent).toBe(1);
    expect((await sendDueReminders(at('2027-02-26'), { channelId: c.channel.id })).sent).toBe(0);
  });
});
