import { describe, expect, it } from 'vitest';
import * as cutSettingsRoute from '@/app/api/channels/[channel]/cut-settings/route';
import * as episodePlanRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/route';
import * as shoppingRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/shopping/route';
import * as partRoute from '@/app/api/channels/[channel]/parts/[partId]/route';
import * as segmentPlanRoute from '@/app/api/channels/[channel]/segments/[segmentId]/cut-plan/route';
import * as partsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/parts/route';
import * as stockItemRoute from '@/app/api/channels/[channel]/stock/[stockId]/route';
import * as stockRoute from '@/app/api/channels/[channel]/stock/route';
import type { EpisodePlanDto } from '@/lib/cut-plans/queries';
import { createPart } from '@/lib/parts/queries';
import type { PartDto } from '@/lib/parts/schemas';
import { createStock } from '@/lib/stock/queries';
import type { StockItemDto } from '@/lib/stock/schemas';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';

const readers = ['host', 'shop_hand', 'editor'] as const;
const editors = ['host', 'shop_hand'] as const;
const spf = { kind: 'softwood' as const, species: 'SPF', nominal: '2x4', offers: [{ lengthIn: '10ft', price: '6.20' }] };

const addStock = (c: Crew) => createStock(c.channel.id, { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 120, price: 620 }] });
/** An outlined episode whose level-1 build has 14 legs of 32" on 10 ft 2x4s. */
async function planned(c: Crew) {
  const { episode, segments } = await makeOutlinedEpisode(c);
  const build = segments.find((s) => s.kind === 'build' && s.level === 1)!;
  const stock = await addStock(c);
  const part = await createPart(c.channel.id, build.id, { name: 'Leg', quantity: 14, lengthIn: 32, widthIn: null, thicknessIn: null, stockItemId: stock.id, grain: 'any', note: '' });
  return { episode, segments, build, stock, part };
}

// The tick names the stock made for that crew's episode; params run before the body.
const stockOf = new WeakMap<Crew, string>();

const cases: RouteCase[] = [
  { name: 'GET stock', fn: stockRoute.GET, method: 'GET', allowed: [...readers], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'POST stock',
    fn: stockRoute.POST,
    method: 'POST',
    allowed: [...editors],
    params: (c) => ({ channel: c.channel.slug }),
    body: () => spf,
    badBody: { kind: 'softwood', species: '', nominal: '2x5x', offers: [{ lengthIn: 'ten', price: '-1' }] },
    okStatus: 201,
  },
  {
    name: 'PUT stock item',
    fn: stockItemRoute.PUT,
    method: 'PUT',
    allowed: [...editors],
    params: async (c) => ({ channel: c.channel.slug, stockId: (await addStock(c)).id }),
    body: () => ({ ...spf, offers: [{ lengthIn: '8ft', price: '4.48' }] }),
    badBody: { kind: 'hardwood', species: 'Ash', nominal: '4/5', widthIn: '0', pricePerBoardFoot: 'free', offers: [] },
    okStatus: 200,
  },
  { name: 'DELETE stock item', fn: stockItemRoute.DELETE, method: 'DELETE', allowed: [...editors], params: async (c) => ({ channel: c.channel.slug, stockId: (await addStock(c)).id }), okStatus: 204 },
  { name: 'GET cut settings', fn: cutSettingsRoute.GET, method: 'GET', allowed: [...readers], params: (c) => ({ channel: c.channel.slug }), okStatus: 200 },
  {
    name: 'PATCH cut settings',
    fn: cutSettingsRoute.PATCH,
    method: 'PATCH',
    allowed: [...editors],
    params: (c) => ({ channel: c.channel.slug }),
    body: () => ({ kerfIn: '3/32' }),
    badBody: { kerfIn: '2', lengthUnit: 'cubits' },
    okStatus: 200,
  },
  { name: 'GET parts', fn: partsRoute.GET, method: 'GET', allowed: [...readers], params: async (c) => ({ channel: c.channel.slug, segmentId: (await planned(c)).build.id }), okStatus: 200 },
  {
    name: 'POST part',
    fn: partsRoute.POST,
    method: 'POST',
    allowed: [...editors],
    params: async (c) => ({ channel: c.channel.slug, segmentId: (await planned(c)).build.id }),
    body: () => ({ name: 'Apron', quantity: 4, lengthIn: '11 1/4' }),
    badBody: { name: '', quantity: 0, lengthIn: '32 3/2' },
    okStatus: 201,
  },
  {
    name: 'PATCH part',
    fn: partRoute.PATCH,
    method: 'PATCH',
    allowed: [...editors],
    params: async (c) => ({ channel: c.channel.slug, partId: (await planned(c)).part.id }),
    body: () => ({ cutCount: 3 }),
    badBody: { lengthIn: '-3', grain: 'diagonal' },
    okStatus: 200,
  },
  { name: 'DELETE part', fn: partRoute.DELETE, method: 'DELETE', allowed: [...editors], params: async (c) => ({ channel: c.channel.slug, partId: (await planned(c)).part.id }), okStatus: 204 },
  { name: 'GET segment plan', fn: segmentPlanRoute.GET, method: 'GET', allowed: [...readers], params: async (c) => ({ channel: c.channel.slug, segmentId: (await planned(c)).build.id }), okStatus: 200 },
  { name: 'GET episode plan', fn: episodePlanRoute.GET, method: 'GET', allowed: [...readers], params: async (c) => ({ channel: c.channel.slug, episodeId: (await planned(c)).episode.id }), okStatus: 200 },
  {
    name: 'PUT shopping tick',
    fn: shoppingRoute.PUT,
    method: 'PUT',
    allowed: [...editors],
    params: async (c) => {
      const p = await planned(c);
      stockOf.set(c, p.stock.id);
      return { channel: c.channel.slug, episodeId: p.episode.id };
    },
    body: (c) => ({ stockItemId: stockOf.get(c) ?? '00000000-0000-4000-8000-000000000000', sizeKey: '120', bought: 5 }),
    badBody: { stockItemId: 'x', sizeKey: '../', bought: -1 },
    okStatus: 200,
  },
];

describeRouteMatrix(cases);

const episodePlan = async (c: Crew, episodeId: string) => {
  const res = await call(episodePlanRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug, episodeId } });
  expect(res.status).toBe(200);
  return res.json as unknown as EpisodePlanDto;
};

describe('stock rack', () => {
  it('computes the dressed size and name of a softwood profile, and refuses a duplicate', async () => {
    const c = await makeCrew();
    const res = await call(stockRoute.POST, 'POST', { as: c.shopHand, params: { channel: c.channel.slug }, body: { ...spf, offers: [{ lengthIn: '8ft', price: '4.50' }, { lengthIn: '10ft', price: 6.2 }] } });
    expect(res.status).toBe(201);
    const item = res.json.stockItem as StockItemDto;
    // Source: NIST PS 20, dry dressed 2x4 = 1 1/2 x 3 1/2 in.
    expect(item).toMatchObject({ name: '2x4 SPF', thicknessIn: 1.5, widthIn: 3.5, offers: [{ lengthIn: 96, priceCents: 450 }, { lengthIn: 120, priceCents: 620 }] });
    const again = await call(stockRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug }, body: spf });
    expect(again.status).toBe(409);
  });

  it('takes plywood at its actual thickness and prices hardwood by the board foot', async () => {
    const c = await makeCrew();
    const ply = await call(stockRoute.POST, 'POST', {
      as: c.host,
      params: { channel: c.channel.slug },
      body: { kind: 'sheet', species: 'Birch plywood', nominal: '3/4', offers: [{ widthIn: '4ft', lengthIn: '8ft', price: '72' }] },
    });
    // From memory (PS 1 and retail sizing): nominal 3/4" plywood is 23/32" actual.
    expect((ply.json.stockItem as StockItemDto).thicknessIn).toBeCloseTo(23 / 32, 9);
    const oak = await call(stockRoute.POST, 'POST', {
      as: c.host,
      params: { channel: c.channel.slug },
      body: { kind: 'hardwood', species: 'White oak', nominal: '4/4', widthIn: '6', pricePerBoardFoot: '9.00', offers: [{ lengthIn: '96' }] },
    });
    expect(oak.status).toBe(201);
    const { episode, segments } = await makeOutlinedEpisode(c);
    const build = segments.find((s) => s.level === 3)!;
    const add = await call(partsRoute.POST, 'POST', { as: c.shopHand, params: { channel: c.channel.slug, segmentId: build.id }, body: { name: 'Top', quantity: 1, lengthIn: '40', stockItemId: (oak.json.stockItem as StockItemDto).id } });
    expect(add.status).toBe(201);
    const plan = await episodePlan(c, episode.id);
    // Source: USDA FPL Wood Handbook, 1 board foot = 144 in³: 1 x 6 x 96 / 144 = 4 board feet at $9.00.
    expect(plan.whole.groups[0]?.purchase[0]).toMatchObject({ count: 1, unitCents: 3600 });
  });
});

describe('parts and plans', () => {
  it('plans fourteen 32" legs on five 10 ft boards and follows the kerf setting', async () => {
    const c = await makeCrew();
    const { episode } = await planned(c);
    let plan = await episodePlan(c, episode.id);
    // Common practice, no published source: three 32" pieces per 10 ft board with a 1/8" kerf.
    expect(plan.whole.groups[0]?.purchase).toMatchObject([{ sizeKey: '120', count: 5, costCents: 3100 }]);
    expect(plan.levels.map((l) => l.level)).toEqual([1]);
    expect(plan.whole.optimal).toBe(true);
    const settings = await call(cutSettingsRoute.PATCH, 'PATCH', { as: c.shopHand, params: { channel: c.channel.slug }, body: { endTrimIn: '12' } });
    expect(settings.status).toBe(200);
    plan = await episodePlan(c, episode.id);
    // 96" usable: two 32" legs per board with a 1/8" kerf, so seven boards.
    expect(plan.whole.groups[0]?.purchase[0]?.count).toBe(7);
  });

  it('refuses parts on a non-build segment, foreign stock and bad lengths, and keeps the part as it was', async () => {
    const c = await makeCrew();
    const other = await makeCrew();
    const { segments, part } = await planned(c);
    const foreign = await addStock(other);
    const outro = segments.find((s) => s.kind === 'outro')!;
    const onOutro = await call(partsRoute.POST, 'POST', { as: c.host, params: { channel: c.channel.slug, segmentId: outro.id }, body: { name: 'Leg', quantity: 1, lengthIn: '10' } });
    expect(onOutro.status).toBe(400);
    const patch = async (body: unknown) => call(partRoute.PATCH, 'PATCH', { as: c.shopHand, params: { channel: c.channel.slug, partId: part.id }, body });
    expect((await patch({ stockItemId: foreign.id, name: 'Changed' })).json.error?.fields?.stockItemId).toBeTruthy();
    expect((await patch({ lengthIn: '32 3/2' })).json.error?.fields?.lengthIn).toMatch(/Write a length/);
    expect((await patch({ cutCount: 15 })).status).toBe(400);
    const list = await call(partsRoute.GET, 'GET', { as: c.editor, params: { channel: c.channel.slug, segmentId: part.segmentId } });
    expect((list.json.parts as PartDto[])[0]).toMatchObject({ name: 'Leg', lengthIn: 32, cutCount: 0, stockItemId: part.stockItemId });
    const ok = await patch({ lengthIn: "2' 8 1/2\"", cutCount: 2 });
    expect(ok.json.part).toMatchObject({ lengthIn: 32.5, cutCount: 2 });
  });

  it('keeps shopping ticks, and lists parts whose stock was deleted instead of dropping them', async () => {
    const c = await makeCrew();
    const { episode, stock } = await planned(c);
    const tick = await call(shoppingRoute.PUT, 'PUT', { as: c.shopHand, params: { channel: c.channel.slug, episodeId: episode.id }, body: { stockItemId: stock.id, sizeKey: '120', bought: 5 } });
    expect(tick.status).toBe(200);
    expect((await episodePlan(c, episode.id)).ticks).toEqual([{ stockItemId: stock.id, sizeKey: '120', bought: 5 }]);
    const del = await call(stockItemRoute.DELETE, 'DELETE', { as: c.host, params: { channel: c.channel.slug, stockId: stock.id } });
    expect(del.status).toBe(204);
    const plan = await episodePlan(c, episode.id);
    expect(plan.whole.groups).toEqual([]);
    expect(plan.whole.noStock).toMatchObject([{ name: 'Leg', quantity: 14 }]);
  });
});
