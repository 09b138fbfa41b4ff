import { describe, expect, it } from 'vitest';
import { findMembership } from '@/lib/channels/queries';
import { createShot } from '@/lib/shots/queries';
import { setSegmentTools } from '@/lib/safety/queries';
import { getShootSheet } from '@/lib/shots/shoot-sheet';
import { makeCrew } from './helpers';
import { makeShotEpisode } from './shot-fixtures';

describe('shoot-day sheet', () => {
  it('lists the day’s shots and undated ones per segment in running order, with tools and parts', async () => {
    const c = await makeCrew();
    const { episode, build, shopShot, hostShot } = await makeShotEpisode(c);
    const later = await createShot(c.channel.id, build.id, { description: 'Finish pass', framing: 'close_up', camera: 'a_cam', assigneeId: null, dueDate: '2027-01-20', notes: '' });
    await setSegmentTools(c.channel.id, build.id, { tools: ['miter_saw'], otherTool: '' });
    const member = (await findMembership(c.channel.slug, c.editor.id))!;

    const sheet = await getShootSheet(member, episode.id, '2027-01-16');
    expect(sheet.segments.map((s) => s.position)).toEqual([1, 2, 3, 4, 5, 6]);
    const day = sheet.segments.find((s) => s.segment.id === build.id)!;
    expect(day.shots.map((s) => s.id)).toEqual([shopShot.id, hostShot.id]);
    expect(day.otherDayShots).toBe(1);
    expect(day.safety).toMatchObject({ tools: ['miter_saw'], needsReview: true, reviewedAt: null });

    const other = await getShootSheet(member, episode.id, '2027-01-20');
    expect(other.segments.find((s) => s.segment.id === build.id)!.shots.map((s) => s.id)).toEqual([hostShot.id, later.id]);
  });

  it('is not found for another channel’s episode', async () => {
    const c = await makeCrew();
    const { episode } = await makeShotEpisode(c);
    const other = await makeCrew();
    const member = (await findMembership(other.channel.slug, other.host.id))!;
    await expect(getShootSheet(member, episode.id)).rejects.toMatchObject({ code: 'not_found' });
  });
});
