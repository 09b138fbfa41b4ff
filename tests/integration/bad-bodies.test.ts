import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import * as channelRoute from '@/app/api/channels/[channel]/route';
import * as memberRoute from '@/app/api/channels/[channel]/crew/[userId]/route';
import * as resendRoute from '@/app/api/channels/[channel]/invitations/[invitationId]/resend/route';
import * as invitationsRoute from '@/app/api/channels/[channel]/invitations/route';
import * as channelsRoute from '@/app/api/channels/route';
import * as acceptRoute from '@/app/api/invitations/[token]/accept/route';
import * as signUpRoute from '@/app/api/sign-up/route';
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
import { createInvitation } from '@/lib/crew/queries';
import { createPart } from '@/lib/parts/queries';
import { createStock } from '@/lib/stock/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew, uniqueEmail } from './helpers';

// Bodies of every shape: arbitrary JSON, JSON-looking junk, near-miss objects with wrong types and extra keys.
const nearMiss = fc.dictionary(
  fc.constantFrom('email', 'role', 'name', 'password', 'channelName', 'speakingRateWpm', 'title', 'kind', 'level', 'stage', 'targetSeconds', 'shootDate', 'publishDate', 'levelLabels', 'archived', 'actionSeconds', 'afterId', 'doc', 'baseVersion', 'species', 'nominal', 'offers', 'lengthIn', 'widthIn', 'price', 'pricePerBoardFoot', 'plywood', 'quantity', 'thicknessIn', 'stockItemId', 'grain', 'note', 'cutCount', 'kerfIn', 'endTrimIn', 'minOffcutIn', 'lengthUnit', 'sizeKey', 'bought', '__proto__', 'x'),
  fc.oneof(fc.jsonValue(), fc.string({ maxLength: 400 }), fc.integer(), fc.double(), fc.constant(null)),
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
beforeAll(async () => {
  crew = await makeCrew();
  const outlined = await makeOutlinedEpisode(crew);
  episodeId = outlined.episode.id;
  segmentId = outlined.segments[2]!.id;
  buildId = outlined.segments.find((x) => x.kind === 'build')!.id;
  stockId = (await createStock(crew.channel.id, { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 96, price: 448 }] })).id;
  partId = (await createPart(crew.channel.id, buildId, { name: 'Leg', quantity: 4, lengthIn: 20, widthIn: null, thicknessIn: null, stockItemId: stockId, grain: 'any', note: '' })).id;
  invitationId = (await createInvitation(crew.channel.id, crew.host.id, { email: uniqueEmail('fuzz'), role: 'editor' })).invitation.id;
});

const targets = (): { name: string; fn: Parameters<typeof call>[0]; method: string; params: Record<string, string> }[] => [
  { name: 'sign-up', fn: signUpRoute.POST, method: 'POST', params: {} },
  { name: 'create channel', fn: channelsRoute.POST, method: 'POST', params: {} },
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
];

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
