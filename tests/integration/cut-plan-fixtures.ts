import { createEpisode } from '@/lib/episodes/queries';
import { createPart } from '@/lib/parts/queries';
import { addThreeLevelBuild } from '@/lib/segments/queries';
import { createStock } from '@/lib/stock/queries';
import { LOAD_PROFILES, LOAD_STOCK_ITEMS, loadParts, loadStock } from '@/tests/fixtures/cut-plan-load';

/**
 * The load of issue 12 in a real channel: 8 stock items of 9 parts each on the three level builds
 * of one new episode. `seed` varies the lengths, so two episodes are two different plans.
 * Takes the channel id alone, so bench/ can use it too.
 */
export async function makeLoadEpisode(c: { channel: { id: string } }, seed = 12) {
  const channelId = c.channel.id;
  const episode = await createEpisode(channelId, { title: `Load ${seed}`, premise: '', stage: 'outline', targetSeconds: 900, shootDate: null, publishDate: null });
  const segments = await addThreeLevelBuild(channelId, episode.id);
  const stock = [];
  for (const [i, item] of loadStock(Array.from({ length: LOAD_STOCK_ITEMS }, (_, i) => String(i))).entries()) {
    const profile = LOAD_PROFILES[i % LOAD_PROFILES.length];
    const offers = item.offers.map((o) => ({ lengthIn: o.lengthIn, price: o.priceCents }));
    stock.push(await createStock(channelId, { kind: 'softwood', species: `Load ${seed}.${i}`, nominal: profile?.nominal ?? '1x4', offers }));
  }
  const parts = loadParts(
    stock.map((s) => s.id),
    seed,
  );
  for (const p of parts) {
    const build = segments.find((s) => s.kind === 'build' && s.level === p.level);
    if (!build) throw new Error(`no level ${p.level} build`);
    await createPart(channelId, build.id, { name: p.name, quantity: p.quantity, lengthIn: p.lengthIn, widthIn: null, thicknessIn: null, stockItemId: p.stockItemId, grain: 'any', note: '' });
  }
  return { episode, segments, stock };
}
