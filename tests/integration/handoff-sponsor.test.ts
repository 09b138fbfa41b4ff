import { describe, expect, it } from 'vitest';
import { findHandoff, lockHandoff } from '@/lib/handoffs/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import { hostMember } from './handoff-fixtures';
import { makeCrew } from './helpers';
import { makeDeal } from './sponsor-fixtures';

// Issue 14 with issue 13: a locked version carries what each sponsor read must contain, without fees.
describe('the handoff snapshot and sponsor deliverables', () => {
  it('holds the read’s sponsor, disclosure, placement, talking points and must-say, and where the read starts', async () => {
    const c = await makeCrew();
    const { episode, read, deliverable } = await makeDeal(c);
    await lockHandoff(await hostMember(c), c.host, episode.id, { note: '' });
    const { snapshot } = await findHandoff(c.channel.id, episode.id, 1);
    const readSegment = snapshot.segments.find((s) => s.id === read.id);
    expect(snapshot.sponsorDeliverables).toEqual([
      {
        id: deliverable.id,
        sponsorName: 'Bramblewick Abrasives',
        segmentId: read.id,
        talkingPoints: ['Mention the hook-and-loop discs.', 'Must say: “code KERF10”'],
        disclosure: 'This video is sponsored by Bramblewick',
        placementRule: 'within the first 50 %',
        forecastStartSeconds: readSegment?.startSeconds,
      },
    ]);
    expect(JSON.stringify(snapshot)).not.toMatch(/250000|feeMinor|USD/);
  });

  it('is empty for an episode without deals, even when another episode of the channel has one', async () => {
    const c = await makeCrew();
    await makeDeal(c);
    const { episode } = await makeOutlinedEpisode(c);
    await lockHandoff(await hostMember(c), c.host, episode.id, { note: '' });
    expect((await findHandoff(c.channel.id, episode.id, 1)).snapshot.sponsorDeliverables).toEqual([]);
  });
});
