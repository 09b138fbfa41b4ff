import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import * as channelRoute from '@/app/api/channels/[channel]/route';
import * as memberRoute from '@/app/api/channels/[channel]/crew/[userId]/route';
import * as resendRoute from '@/app/api/channels/[channel]/invitations/[invitationId]/resend/route';
import * as invitationsRoute from '@/app/api/channels/[channel]/invitations/route';
import * as channelsRoute from '@/app/api/channels/route';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as signUpRoute from '@/app/api/sign-up/route';
import * as profileRoute from '@/app/api/profile/route';
import * as episodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/route';
import * as segmentsRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/segments/route';
import * as episodesRoute from '@/app/api/channels/[channel]/episodes/route';
import * as positionRoute from '@/app/api/channels/[channel]/segments/[segmentId]/position/route';
import * as segmentRoute from '@/app/api/channels/[channel]/segments/[segmentId]/route';
import * as scriptRoute from '@/app/api/channels/[channel]/segments/[segmentId]/script/route';
import * as cutSettingsRoute from '@/app/api/channels/[channel]/cut-settings/route';
import * as shoppingRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/shopping/route';
import * as partRoute from '@/app/api/channels/[channel]/parts/[partId]/route';
import * as partsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/parts/route';
import * as stockItemRoute from '@/app/api/channels/[channel]/stock/[stockId]/route';
import * as stockRoute from '@/app/api/channels/[channel]/stock/route';
import * as shotBulkRoute from '@/app/api/channels/[channel]/segments/[segmentId]/shots/bulk/route';
import * as segmentShotsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/shots/route';
import * as toolsRoute from '@/app/api/channels/[channel]/segments/[segmentId]/tools/route';
import * as safetyReviewRoute from '@/app/api/channels/[channel]/segments/[segmentId]/safety-review/route';
import * as shotRoute from '@/app/api/channels/[channel]/shots/[shotId]/route';
import * as shotPositionRoute from '@/app/api/channels/[channel]/shots/[shotId]/position/route';
import * as shotStateRoute from '@/app/api/channels/[channel]/shots/[shotId]/state/route';
import { createInvitation } from '@/lib/crew/queries';
import { createShot } from '@/lib/shots/queries';
import { createPart } from '@/lib/parts/queries';
import { createStock } from '@/lib/stock/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew, uniqueEmail } from './helpers';

// Bodies of every shape: arbitrary JSON, JSON-looking junk, near-miss objects with wrong types and extra keys.
const nearMiss = fc.dictionary(
  fc.constantFrom('email', 'role', 'name', 'password', 'channelName', 'speakingRateWpm', 'title', 'kind', 'level', 'stage', 'targetSeconds', 'shootDate', 'publishDate', 'levelLabels', 'archived', 'actionSeconds', 'afterId', 'doc', 'baseVersion', 'species', 'nominal', 'offers', 'lengthIn', 'widthIn', 'price', 'pricePerBoardFoot', 'plywood', 'quantity', 'thicknessIn', 'stockItemId', 'grain', 'note', 'cutCount', 'kerfIn', 'endTrimIn', 'minOffcutIn', 'jointIn', 'lengthUnit', 'sizeKey', 'bought', 'description', 'framing', 'camera', 'assigneeId', 'dueDate', 'notes', 'text', 'state', 'reason', 'tools', 'otherTool', 'reviewed', 'emailOptOut', '__proto__', 'x'),
  fc.oneof(fc.jsonValue(), fc.string({ maxLength: 400 }), fc.integer(), fc.double(), fc.constant(null), fc.constant('nul \u0000 inside')),
);
const rawBody = fc.oneof(
  fc.jsonValue().map((v) => JSON.stringify(v) ?? 'null'),
  nearMiss.map((v) => JSON.stringify(v)),
  fc.string({ maxLength: 200 }),
  fc.constantFrom('', '{', '[]', 'null', '"str"', '{"a":1}{', '\u0000', '{"email":"\ud800"}'),
);
const contentType = fc.constantFrom('application/json', 'application/json; charset=utf-8', 'text/plain', '');

let crew: Awaited<ReturnType<typeof makeCrew>>;
let invitationId: string;
let episodeId: string;
let segmentId: string;
let buildId: string;
let stockId: string;
let partId: string;
let shotId: string;
beforeAll(async () => {
  crew = await makeCrew();
  const outlined = await makeOutlinedEpisode(crew);
  episodeId = outlined.episode.id;
  segmentId = outlined.segments[2]!.id;
  buildId = outlined.segments.find((x) => x.kind === 'build')!.id;
  stockId = (await createStock(crew.channel.id, { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 96, price: 448 }] })).id;
  partId = (await createPart(crew.channel.id, buildId, { name: 'Leg', quantity: 4, lengthIn: 20, widthIn: null, thicknessIn: null, stockItemId: stockId, grain: 'any', note: '' })).id;
  shotId = (await createShot(crew.channel.id, buildId, { description: 'Rip the legs', framing: 'wide', camera: 'a_cam', assigneeId: crew.shopHand.id, dueDate: null, notes: '' })).id;
  invitationId = (await createInvitation(crew.channel.id, crew.host.id, { email: uniqueEmail('fuzz'), role: 'editor' })).invitation.id;
});

const targets = (): { name: string; fn: Parameters<typeof call>[0]; method: string; params: Record<string, string> }[] => [
  { name: 'sign-up', fn: signUpRoute.POST, method: 'POST', params: {} },
  { name: 'create channel', fn: channelsRoute.POST, method: 'POST', params: {} },
  { name: 'profile', fn: profileRoute.PATCH, method: 'PATCH', params: {} },
  { name: 'channel settings', fn: channelRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug } },
  { name: 'change role', fn: memberRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, userId: crew.editor.id } },
  { name: 'invite', fn: invitationsRoute.POST, method: 'POST', params: { channel: crew.channel.slug } },
  { name: 'resend', fn: resendRoute.POST, method: 'POST', params: { channel: crew.channel.slug, invitationId } },
  { name: 'accept', fn: acceptRoute.POST, method: 'POST', params: { token: 'A'.repeat(43) } },
  { name: 'create episode', fn: episodesRoute.POST, method: 'POST', params: { channel: crew.channel.slug } },
  { name: 'update episode', fn: episodeRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, episodeId } },
  { name: 'create segment', fn: segmentsRoute.POST, method: 'POST', params: { channel: crew.channel.slug, episodeId } },
  { name: 'update segment', fn: segmentRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, segmentId } },
  { name: 'save script', fn: scriptRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, segmentId } },
  { name: 'move segment', fn: positionRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, segmentId } },
  { name: 'add stock', fn: stockRoute.POST, method: 'POST', params: { channel: crew.channel.slug } },
  { name: 'replace stock', fn: stockItemRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, stockId } },
  { name: 'cut settings', fn: cutSettingsRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug } },
  { name: 'add part', fn: partsRoute.POST, method: 'POST', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'update part', fn: partRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, partId } },
  { name: 'shopping tick', fn: shoppingRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, episodeId } },
  { name: 'add shot', fn: segmentShotsRoute.POST, method: 'POST', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'paste shots', fn: shotBulkRoute.POST, method: 'POST', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'update shot', fn: shotRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, shotId } },
  { name: 'move shot', fn: shotPositionRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, shotId } },
  { name: 'shot state', fn: shotStateRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, shotId } },
  { name: 'segment tools', fn: toolsRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'safety review', fn: safetyReviewRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, segmentId: buildId } },
];

type ShapedRun = [name: string, fn: Parameters<typeof call>[0], method: string, params: Record<string, string>, body: fc.Arbitrary<unknown>];

/** Bodies of the right shape never make a 500, and a 400 for bad input always names its fields. */
async function assertNo500(runs: ShapedRun[], numRuns: number) {
  for (const [name, fn, method, params, body] of runs) {
    await fc.assert(
      fc.asyncProperty(body, async (b) => {
        const res = await call(fn, method, { as: crew.host, params, body: b });
        expect(res.status, `${name}: ${JSON.stringify(b)}`).toBeLessThan(500);
        if (res.status === 400 && res.json.error?.code === 'invalid_input') expect(Object.keys(res.json.error.fields ?? {}).length).toBeGreaterThan(0);
      }),
      { numRuns },
    );
  }
}

describe('no body makes a 500', () => {
  it('for every route with a body', async () => {
    for (const t of targets()) {
      await fc.assert(
        fc.asyncProperty(rawBody, contentType, async (body, type) => {
          const res = await call(t.fn, t.method, { as: crew.host, params: t.params, rawBody: body, headers: type ? { 'content-type': type } : {} });
          expect(res.status, `${t.name}: ${body}`).toBeLessThan(500);
          if (res.status >= 400) expect(typeof res.json.error?.message).toBe('string');
        }),
        { numRuns: 30 },
      );
    }
  });
});

// Script bodies near the real shape: Tiptap-like trees with wrong node types, attrs and nesting.
const node: fc.Arbitrary<unknown> = fc.letrec((tie) => ({
  node: fc.record(
    {
      type: fc.constantFrom('doc', 'paragraph', 'heading', 'text', 'listItem', 'bulletList', 'image', 'link', 'codeBlock'),
      text: fc.string({ maxLength: 20 }),
      attrs: fc.dictionary(fc.constantFrom('level', 'start', 'href', 'src', 'type'), fc.jsonValue()),
      marks: fc.array(fc.record({ type: fc.constantFrom('bold', 'link', 'code', 'highlight') }), { maxLength: 2 }),
      content: fc.array(tie('node'), { maxLength: 3 }),
    },
    { requiredKeys: ['type'] },
  ),
})).node;

describe('no script tree makes a 500', () => {
  it('for arbitrary Tiptap-like documents', async () => {
    await fc.assert(
      fc.asyncProperty(node, fc.integer({ min: -1, max: 3 }), async (doc, baseVersion) => {
        const res = await call(scriptRoute.PUT, 'PUT', { as: crew.host, params: { channel: crew.channel.slug, segmentId }, body: { doc, baseVersion } });
        expect(res.status).toBeLessThan(500);
      }),
      { numRuns: 60 },
    );
  });
});

// Rack, part and settings bodies near the real shape: shop-notation lengths, sizes and prices, right and wrong.
const shopLength = fc.oneof(
  fc.stringMatching(/^[0-9 '"/.\-xXftinchesmc’″]{0,14}$/),
  fc.constantFrom('32 1/2', "2' 8\"", '813mm', '8ft', '10 ft', '1-1/2', '3/4', '32 3/2', '1/0', '0/0', '.5', '99999999999999999999999', "9999999999999999999'"),
  fc.double(),
  fc.integer({ min: -5, max: 2000 }),
);
const shopText = fc.oneof(fc.string({ maxLength: 90 }), fc.constantFrom('2x4', '2 x 10', '2x5x', '4/4', '16/4', '17/4', '0/4', '3/4', 'SPF', ''));
const price = fc.oneof(fc.constantFrom('4.50', '$6.20', '0', '0.001', '-1', '1e3', '100000.01'), fc.double(), fc.integer({ min: -10, max: 20_000_000 }));
const offer = fc.record({ lengthIn: shopLength, widthIn: shopLength, price }, { requiredKeys: [] });
const stockBody = fc.record(
  {
    kind: fc.constantFrom('softwood', 'hardwood', 'sheet', 'plastic'),
    species: shopText,
    nominal: fc.oneof(shopText, shopLength),
    widthIn: shopLength,
    pricePerBoardFoot: price,
    plywood: fc.oneof(fc.boolean(), fc.constant('yes')),
    offers: fc.array(offer, { maxLength: 14 }),
  },
  { requiredKeys: ['kind'] },
);
const partFields = (stockItemId: string) => ({
  name: shopText,
  quantity: fc.oneof(fc.integer({ min: -2, max: 600 }), fc.double()),
  lengthIn: shopLength,
  widthIn: fc.oneof(shopLength, fc.constant(null)),
  thicknessIn: fc.oneof(shopLength, fc.constant(null)),
  stockItemId: fc.oneof(fc.constant(stockItemId), fc.uuid(), fc.constant(null), fc.constant('x')),
  grain: fc.constantFrom('length', 'any', 'across'),
  note: fc.string({ maxLength: 210 }),
});
const settingsBody = fc.record({ kerfIn: shopLength, endTrimIn: shopLength, minOffcutIn: shopLength, jointIn: shopLength, lengthUnit: fc.constantFrom('in', 'mm', 'cubit') }, { requiredKeys: [] });

describe('no rack, part or settings body makes a 500', () => {
  it('for shop-notation bodies of the right shape', async () => {
    const ch = crew.channel.slug;
    const runs: ShapedRun[] = [
      ['add stock', stockRoute.POST, 'POST', { channel: ch }, stockBody],
      ['replace stock', stockItemRoute.PUT, 'PUT', { channel: ch, stockId }, stockBody],
      ['add part', partsRoute.POST, 'POST', { channel: ch, segmentId: buildId }, fc.record(partFields(stockId), { requiredKeys: [] })],
      ['update part', partRoute.PATCH, 'PATCH', { channel: ch, partId }, fc.record({ ...partFields(stockId), cutCount: fc.integer({ min: -1, max: 600 }) }, { requiredKeys: [] })],
      ['cut settings', cutSettingsRoute.PATCH, 'PATCH', { channel: ch }, settingsBody],
    ];
    await assertNo500(runs, 80);
  });
});

// Shot bodies near the real shape: framings, cameras and states right and wrong, dates real and not.
const day = fc.oneof(fc.constantFrom('2027-01-16', '2027-02-30', '2027-1-6', '', 'today', null), fc.string({ maxLength: 12 }));
const shotBody = (assignee: string) =>
  fc.record(
    {
      description: fc.oneof(fc.string({ maxLength: 320 }), fc.constantFrom('  ', 'CU: glue')),
      framing: fc.constantFrom('wide', 'close_up', 'dutch', ''),
      camera: fc.constantFrom('a_cam', 'top_cam', 'drone'),
      assigneeId: fc.oneof(fc.constant(assignee), fc.uuid(), fc.constant(null), fc.constant('none')),
      dueDate: day,
      notes: fc.string({ maxLength: 1010 }),
    },
    { requiredKeys: [] },
  );
const pasted = fc.array(fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom('CU:', 'Wide / Top cam: plane', '- 1. POV: chisel', 'XCU', ':', 'Insert: ')), { maxLength: 120 }).map((l) => l.join('\n'));

describe('no shot body makes a 500', () => {
  it('for shot-shaped bodies', async () => {
    const ch = crew.channel.slug;
    const runs: ShapedRun[] = [
      ['add shot', segmentShotsRoute.POST, 'POST', { channel: ch, segmentId: buildId }, shotBody(crew.shopHand.id)],
      ['update shot', shotRoute.PATCH, 'PATCH', { channel: ch, shotId }, shotBody(crew.shopHand.id)],
      ['paste shots', shotBulkRoute.POST, 'POST', { channel: ch, segmentId: buildId }, fc.record({ text: pasted, assigneeId: fc.constantFrom(crew.editor.id, null), dueDate: day }, { requiredKeys: ['text'] })],
      [
        'shot state',
        shotStateRoute.PUT,
        'PUT',
        { channel: ch, shotId },
        fc.record({ state: fc.constantFrom('planned', 'captured', 'retake', 'lost'), reason: fc.string({ maxLength: 310 }), afterId: fc.oneof(fc.uuid(), fc.constant(null), fc.constant(shotId)) }, { requiredKeys: [] }),
      ],
      ['segment tools', toolsRoute.PUT, 'PUT', { channel: ch, segmentId: buildId }, fc.record({ tools: fc.array(fc.constantFrom('router', 'other', 'lathe', 'table_saw')), otherTool: fc.string({ maxLength: 90 }) }, { requiredKeys: [] })],
    ];
    await assertNo500(runs, 60);
  });
});
