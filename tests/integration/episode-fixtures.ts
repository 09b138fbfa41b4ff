import { createEpisode } from '@/lib/episodes/queries';
import { addThreeLevelBuild } from '@/lib/segments/queries';
import type { Crew } from './route-matrix';

export async function makeEpisode(c: Crew, title = 'Walnut step stool') {
  return createEpisode(c.channel.id, { title, premise: '', stage: 'outline', targetSeconds: 900, shootDate: null, publishDate: null });
}

/** An episode with the six starter segments, in running order. */
export async function makeOutlinedEpisode(c: Crew) {
  const episode = await makeEpisode(c);
  const segments = await addThreeLevelBuild(c.channel.id, episode.id);
  return { episode, segments };
}
