import { describe, expect, it } from 'vitest';
import { channelSlugSchema } from './schemas';
import { makeChannelSlug, slugifyChannelName } from './slug';

describe('channel slugs', () => {
  it.each([
    ['Tallowmere Woodshop', 'tallowmere-woodshop'],
    ['  Plank & Peg!! ', 'plank-peg'],
    ['Scie Éclair', 'scie-eclair'],
    ['木工', 'channel'],
  ])('%j -> %j', (name, slug) => {
    expect(slugifyChannelName(name)).toBe(slug);
  });
  it('adds a random tail and always passes the slug schema', () => {
    const slug = makeChannelSlug('A'.repeat(200));
    expect(slug.length).toBeLessThanOrEqual(80);
    expect(channelSlugSchema.safeParse(slug).success).toBe(true);
    expect(makeChannelSlug('Shop')).not.toBe(makeChannelSlug('Shop'));
  });
});
