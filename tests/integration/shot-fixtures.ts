import { createShot } from '@/lib/shots/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import type { Crew } from './route-matrix';

/** An outlined episode whose level-1 build has one shot assigned to the shop hand and one to the host. */
export async function makeShotEpisode(c: Crew) {
  const { episode, segments } = await makeOutlinedEpisode(c);
  const build = segments.find((s) => s.kind === 'build' && s.level === 1)!;
  const shopShot = await createShot(c.channel.id, build.id, {
    description: 'Crosscut the legs',
    framing: 'wide',
    camera: 'a_cam',
    assigneeId: c.shopHand.id,
    dueDate: '2027-01-16',
    notes: '',
  });
  const hostShot = await createShot(c.channel.id, build.id, {
    description: 'Host explains the joint',
    framing: 'medium',
    camera: 'b_cam',
    assigneeId: c.host.id,
    dueDate: null,
    notes: '',
  });
  return { episode, segments, build, shopShot, hostShot };
}
