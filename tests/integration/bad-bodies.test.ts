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
import * as sessionsRoute from '@/app/api/profile/sessions/route';
import * as episodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/route';
import * as segmentsRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/segments/route';
import * as episodesRoute from '@/app/api/channels/[channel]/episodes/route';
import * as positionRoute from '@/app/api/channels/[channel]/segments/[segmentId]/position/route';
import * as segmentRoute from '@/app/api/channels/[channel]/segments/[segmentId]/route';
import * as scriptRoute from '@/app/api/channels/[channel]/segments/[segmentId]/script/route';
import * as cutSettingsRoute from '@/app/api/channels/[channel]/cut-settings/route';
import * as shoppingRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/shopping/route';
import * as cutsDoneRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/done/route';
import * as takeBackRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/cut-plan/done/[recordId]/route';
import * as onHandRoute from '@/app/api/channels/[channel]/on-hand/route';
import * as onHandPieceRoute from '@/app/api/channels/[channel]/on-hand/[pieceId]/route';
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
import * as starterRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/starter/route';
import * as duplicateRoute from '@/app/api/channels/[channel]/shots/[shotId]/duplicate/route';
import * as restoreRoute from '@/app/api/channels/[channel]/shots/[shotId]/restore/route';
import * as shotMailRoute from '@/app/api/channels/[channel]/shot-mail/route';
import * as sponsorsRoute from '@/app/api/channels/[channel]/sponsors/route';
import * as sponsorRoute from '@/app/api/channels/[channel]/sponsors/[sponsorId]/route';
import * as dealsRoute from '@/app/api/channels/[channel]/deals/route';
import * as dealRoute from '@/app/api/channels/[channel]/deals/[dealId]/route';
import * as deliverablesRoute from '@/app/api/channels/[channel]/deals/[dealId]/deliverables/route';
import * as deliverableRoute from '@/app/api/channels/[channel]/deliverables/[deliverableId]/route';
import * as dueDateRoute from '@/app/api/channels/[channel]/deliverables/[deliverableId]/due-dates/[kind]/route';
import * as approvalLinksRoute from '@/app/api/channels/[channel]/deliverables/[deliverableId]/approval-links/route';
import * as approvalRoute from '@/app/api/approvals/[token]/route';
import * as calendarFeedRoute from '@/app/api/profile/calendar-feed/route';
import * as editStageRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/edit-stage/route';
import * as handoffsRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/route';
import * as versionNotesRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/[version]/notes/route';
import * as noteRoute from '@/app/api/channels/[channel]/edit-notes/[noteId]/route';
import * as noteRepliesRoute from '@/app/api/channels/[channel]/edit-notes/[noteId]/replies/route';
import * as clipRoute from '@/app/api/channels/[channel]/clips/[clipId]/route';
import { recordClipOnce } from '@/lib/clips/queries';
import { createNote } from '@/lib/edit/queries';
import { lockHandoff } from '@/lib/handoffs/queries';
import { findMembership } from '@/lib/channels/queries';
import { createInvitation } from '@/lib/crew/queries';
import { createShot } from '@/lib/shots/queries';
import { createPart } from '@/lib/parts/queries';
import { createStock } from '@/lib/stock/queries';
import { addOnHand } from '@/lib/on-hand/queries';
import { makeOutlinedEpisode } from './episode-fixtures';
import { call, makeCrew, makeUser, uniqueEmail } from './helpers';
import { makeDeal } from './sponsor-fixtures';

// Bodies of every shape: arbitrary JSON, JSON-looking junk, near-miss objects with wrong types and extra keys.
const nearMiss = fc.dictionary(
  fc.constantFrom('email', 'role', 'name', 'password', 'channelName', 'speakingRateWpm', 'reminderDays', 'title', 'kind', 'level', 'stage', 'targetSeconds', 'shootDate', 'publishDate', 'levelLabels', 'archived', 'actionSeconds', 'afterId', 'doc', 'baseVersion', 'species', 'nominal', 'offers', 'lengthIn', 'widthIn', 'price', 'pricePerBoardFoot', 'plywood', 'quantity', 'thicknessIn', 'stockItemId', 'grain', 'note', 'cutCount', 'count', 'kerfIn', 'endTrimIn', 'minOffcutIn', 'jointIn', 'lengthUnit', 'sizeKey', 'board', 'bought', 'description', 'framing', 'camera', 'assigneeId', 'dueDate', 'notes', 'text', 'state', 'reason', 'tools', 'otherTool', 'reviewed', 'emailOptOut', 'contacts', 'sponsorId', 'feeMinor', 'currency', 'paymentTermsDays', 'invoiceState', 'invoiceSentOn', 'paidOn', 'episodeId', 'segmentId', 'talkingPoints', 'mustSay', 'disclosure', 'tracking', 'readMinSeconds', 'readMaxSeconds', 'placement', 'ownerId', 'dueDates', 'dueOn', 'done', 'contactEmail', 'decision', 'comment', 'scriptVersion', 'clipId', 'timecode', 'body', 'resolved', 'shotId', '__proto__', 'x'),
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
let pieceId: string;
let shotId: string;
let sponsor: Awaited<ReturnType<typeof makeDeal>>;
beforeAll(async () => {
  crew = await makeCrew();
  const outlined = await makeOutlinedEpisode(crew);
  episodeId = outlined.episode.id;
  segmentId = outlined.segments[2]!.id;
  buildId = outlined.segments.find((x) => x.kind === 'build')!.id;
  stockId = (await createStock(crew.channel.id, { kind: 'softwood', species: 'SPF', nominal: '2x4', offers: [{ lengthIn: 96, price: 448 }] })).id;
  partId = (await createPart(crew.channel.id, buildId, { name: 'Leg', quantity: 4, lengthIn: 20, widthIn: null, thicknessIn: null, stockItemId: stockId, grain: 'any', note: '' })).id;
  pieceId = (await addOnHand(crew.channel.id, crew.host.id, { stockItemId: stockId, lengthIn: 40, widthIn: null, count: 1 })).id;
  shotId = (await createShot(crew.channel.id, buildId, { description: 'Rip the legs', framing: 'wide', camera: 'a_cam', assigneeId: crew.shopHand.id, dueDate: null, notes: '' })).id;
  invitationId = (await createInvitation(crew.channel.id, crew.host.id, { email: uniqueEmail('fuzz'), role: 'editor' })).invitation.id;
  sponsor = await makeDeal(crew);
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
  { name: 'add on hand', fn: onHandRoute.POST, method: 'POST', params: { channel: crew.channel.slug } },
  { name: 'on-hand count', fn: onHandPieceRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, pieceId } },
  { name: 'mark cuts done', fn: cutsDoneRoute.POST, method: 'POST', params: { channel: crew.channel.slug, episodeId } },
  { name: 'add shot', fn: segmentShotsRoute.POST, method: 'POST', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'paste shots', fn: shotBulkRoute.POST, method: 'POST', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'update shot', fn: shotRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, shotId } },
  { name: 'move shot', fn: shotPositionRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, shotId } },
  { name: 'shot state', fn: shotStateRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, shotId } },
  { name: 'segment tools', fn: toolsRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'safety review', fn: safetyReviewRoute.PUT, method: 'PUT', params: { channel: crew.channel.slug, segmentId: buildId } },
  { name: 'add sponsor', fn: sponsorsRoute.POST, method: 'POST', params: { channel: crew.channel.slug } },
  { name: 'update sponsor', fn: sponsorRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, sponsorId: sponsor.sponsor.id } },
  { name: 'add deal', fn: dealsRoute.POST, method: 'POST', params: { channel: crew.channel.slug } },
  { name: 'update deal', fn: dealRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, dealId: sponsor.deal.id } },
  { name: 'add deliverable', fn: deliverablesRoute.POST, method: 'POST', params: { channel: crew.channel.slug, dealId: sponsor.deal.id } },
  { name: 'update deliverable', fn: deliverableRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, deliverableId: sponsor.deliverable.id } },
  { name: 'send approval link', fn: approvalLinksRoute.POST, method: 'POST', params: { channel: crew.channel.slug, deliverableId: sponsor.deliverable.id } },
  { name: 'make calendar feed', fn: calendarFeedRoute.POST, method: 'POST', params: {} },
  { name: 'decide approval', fn: approvalRoute.POST, method: 'POST', params: { token: 'C'.repeat(43) } },
  { name: 'update due date', fn: dueDateRoute.PATCH, method: 'PATCH', params: { channel: crew.channel.slug, deliverableId: sponsor.deliverable.id, kind: 'go_live' } },
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

// Issue 12, item 3: about 6,000 levels in 12 KB overflowed the recursive NUL check into a 500 on every
// JSON route, signed out too.
describe('a deeply nested body', () => {
  it('is a 400 naming the nesting on every route with a body, signed in or out', async () => {
    const deep = '['.repeat(6000) + ']'.repeat(6000);
    let refused = 0;
    for (const t of targets()) {
      for (const as of [crew.host, null]) {
        const res = await call(t.fn, t.method, { as, params: t.params, rawBody: deep, headers: { 'content-type': 'application/json' } });
        expect(res.status, `${t.name} ${as ? 'signed in' : 'signed out'}`).toBeLessThan(500);
        // Routes that read no body (resend) ignore it; every one that reads it refuses it by name.
        if (res.status === 400) {
          expect(res.json.error?.message, t.name).toBe('The request body is nested too deeply.');
          refused++;
        }
      }
    }
    // Signed in every route that reads a body, signed out sign-up and accept.
    expect(refused).toBeGreaterThanOrEqual(targets().length - 1 + 2);
  });
});

describe('no body makes a 500 on a bodyless route (issue 12 items 14 and 16)', () => {
  it('for starter, duplicate, restore, send to crew and take back cuts done: whatever body and type, never a 500', async () => {
    const ch = crew.channel.slug;
    // A record id that names nothing: the take-back route reads no body and answers 404, never a 500.
    const recordId = '00000000-0000-4000-8000-000000000000';
    const runs: { name: string; fn: Parameters<typeof call>[0]; method: string; params: Record<string, string> }[] = [
      { name: 'starter', fn: starterRoute.POST, method: 'POST', params: { channel: ch, episodeId } },
      { name: 'duplicate shot', fn: duplicateRoute.POST, method: 'POST', params: { channel: ch, shotId } },
      { name: 'restore shot', fn: restoreRoute.POST, method: 'POST', params: { channel: ch, shotId } },
      { name: 'send to crew', fn: shotMailRoute.POST, method: 'POST', params: { channel: ch } },
      { name: 'take back cuts done', fn: takeBackRoute.DELETE, method: 'DELETE', params: { channel: ch, episodeId, recordId } },
    ];
    for (const t of runs) {
      await fc.assert(
        fc.asyncProperty(rawBody, contentType, async (body, type) => {
          const res = await call(t.fn, t.method, { as: crew.host, params: t.params, rawBody: body, headers: type ? { 'content-type': type } : {} });
          expect(res.status, `${t.name}: ${body}`).toBeLessThan(500);
        }),
        { numRuns: 10 },
      );
      // And from another site, refused before anything runs.
      expect((await call(t.fn, t.method, { as: crew.host, params: t.params, headers: { origin: 'https://evil.example' } })).status, t.name).toBe(403);
    }
  });

  it('for “sign out everywhere” (next-auth’s own routes are fuzzed over HTTP in page-status.test.ts)', async () => {
    // A throwaway user: "sign out everywhere" ends the sessions of whoever sends it.
    const user = await makeUser('fuzz-sessions');
    await fc.assert(
      fc.asyncProperty(rawBody, contentType, async (body, type) => {
        const res = await call(sessionsRoute.DELETE, 'DELETE', { as: user, rawBody: body, headers: type ? { 'content-type': type } : {} });
        expect(res.status, body).toBeLessThan(500);
      }),
      { numRuns: 30 },
    );
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
      ['add on hand', onHandRoute.POST, 'POST', { channel: ch }, fc.record({ stockItemId: fc.oneof(fc.constant(stockId), fc.uuid(), fc.constant('x')), lengthIn: shopLength, widthIn: fc.oneof(shopLength, fc.constant(null)), count: fc.oneof(fc.integer({ min: -1, max: 1002 }), fc.double()) }, { requiredKeys: [] })],
      ['on-hand count', onHandPieceRoute.PATCH, 'PATCH', { channel: ch, pieceId }, fc.record({ count: fc.oneof(fc.integer({ min: -1, max: 1002 }), fc.double(), fc.constant('3')) }, { requiredKeys: [] })],
      ['mark cuts done', cutsDoneRoute.POST, 'POST', { channel: ch, episodeId }, fc.record({ stockItemId: fc.oneof(fc.constant(stockId), fc.uuid(), fc.constant('x'), fc.constant(null)) }, { requiredKeys: [] })],
    ];
    await assertNo500(runs, 80);
    // Each accepted "mark cuts done" plans the episode's parts (as the other runs left them) on the worker
    // pool with the route's full time budget, so 80 of them can take far longer than Vitest's 30 s default.
  }, 180_000);
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

// Sponsor bodies near the real shape: amounts, currencies, invoice states with and without their dates.
const money = fc.oneof(fc.integer({ min: -5, max: 200_000_000_000 }), fc.double(), fc.constantFrom('2500', 1e21, -0));
const currency = fc.constantFrom('USD', 'EUR', 'JPY', 'usd', 'XXQ', '', 'EURO');
const seconds = fc.oneof(fc.integer({ min: -5, max: 40_000 }), fc.constantFrom('1:30', '99:99', '0:00', '1:00:00', 'soon', null));

describe('no sponsor body makes a 500', () => {
  it('for deal-, deliverable- and due-date-shaped bodies', async () => {
    const ch = crew.channel.slug;
    const { deal, deliverable, episode, read } = sponsor;
    const deliverableBody = fc.record(
      {
        episodeId: fc.oneof(fc.constant(episode.id), fc.constant(episodeId), fc.uuid(), fc.constant('x')),
        segmentId: fc.oneof(fc.constant(read.id), fc.constant(segmentId), fc.uuid(), fc.constant(null)),
        kind: fc.constantFrom('segment_read', 'social_post', 'billboard'),
        mustSay: fc.array(fc.string({ maxLength: 210 }), { maxLength: 22 }),
        disclosure: fc.string({ maxLength: 510 }),
        tracking: fc.string({ maxLength: 20 }),
        readMinSeconds: seconds,
        readMaxSeconds: seconds,
        placement: fc.oneof(
          fc.constant(null),
          fc.record({ kind: fc.constantFrom('starts_before', 'within_percent', 'after'), seconds, percent: fc.oneof(fc.integer({ min: -1, max: 101 }), fc.double()) }, { requiredKeys: ['kind'] }),
        ),
        ownerId: fc.oneof(fc.constant(crew.editor.id), fc.uuid(), fc.constant(null)),
        dueDates: fc.dictionary(fc.constantFrom('script_due', 'go_live', 'payment_due', 'launch'), day),
      },
      { requiredKeys: [] },
    );
    const dealBody = fc.record(
      {
        sponsorId: fc.oneof(fc.constant(sponsor.sponsor.id), fc.uuid(), fc.constant('x')),
        title: fc.string({ maxLength: 170 }),
        feeMinor: money,
        currency,
        paymentTermsDays: fc.oneof(fc.integer({ min: -1, max: 400 }), fc.double()),
        invoiceState: fc.constantFrom('not_sent', 'sent', 'paid', 'lost'),
        invoiceSentOn: day,
        paidOn: day,
        notes: fc.string({ maxLength: 30 }),
      },
      { requiredKeys: [] },
    );
    const runs: ShapedRun[] = [
      ['add deal', dealsRoute.POST, 'POST', { channel: ch }, dealBody],
      ['update deal', dealRoute.PATCH, 'PATCH', { channel: ch, dealId: deal.id }, dealBody],
      ['add deliverable', deliverablesRoute.POST, 'POST', { channel: ch, dealId: deal.id }, deliverableBody],
      ['update deliverable', deliverableRoute.PATCH, 'PATCH', { channel: ch, deliverableId: deliverable.id }, deliverableBody],
      [
        'update due date',
        dueDateRoute.PATCH,
        'PATCH',
        { channel: ch, deliverableId: deliverable.id, kind: 'payment_due' },
        fc.record({ dueOn: day, done: fc.oneof(fc.boolean(), fc.constant('yes')) }, { requiredKeys: [] }),
      ],
      [
        'add sponsor',
        sponsorsRoute.POST,
        'POST',
        { channel: ch },
        fc.record({ name: fc.string({ maxLength: 130 }), contacts: fc.array(fc.record({ name: fc.string({ maxLength: 5 }), email: fc.constantFrom('a@b.test', 'nope', '') }), { maxLength: 11 }) }, { requiredKeys: [] }),
      ],
    ];
    await assertNo500(runs, 60);
  });
});

// Handoff bodies: lock notes, edit stages, edit notes with timecodes right and wrong for 29.97 DF.
describe('no clip filing body makes a 500 (issue 15)', () => {
  it('for raw bodies and for segment/shot-shaped bodies', async () => {
    const ch = crew.channel.slug;
    const { clipId } = await recordClipOnce({
      uploadId: `fuzz-${Date.now()}`,
      segmentId: buildId,
      shotId: null,
      uploadedBy: crew.host.id,
      originalName: 'A001.mp4',
      mimeType: 'video/mp4',
      sizeBytes: 10,
      sha256: 'f'.repeat(64),
    });
    const params = { channel: ch, clipId };
    await assertNo500([['file clip', clipRoute.PATCH, 'PATCH', params, nearMiss]], 40);
    const id = fc.oneof(fc.constant(buildId), fc.constant(segmentId), fc.constant(shotId), fc.uuid(), fc.constant('x'), fc.constant(null), fc.integer());
    await assertNo500([['file clip', clipRoute.PATCH, 'PATCH', params, fc.record({ segmentId: id, shotId: id }, { requiredKeys: [] })]], 60);
  });
});

describe('no handoff body makes a 500', () => {
  let noteId: string;
  let hEpisodeId: string;
  let hSegmentId: string;
  beforeAll(async () => {
    const outlined = await makeOutlinedEpisode(crew);
    hEpisodeId = outlined.episode.id;
    hSegmentId = outlined.segments[0]!.id;
    const member = (await findMembership(crew.channel.slug, crew.host.id))!;
    await lockHandoff(member, crew.host, hEpisodeId, { note: '' });
    noteId = (await createNote(member, crew.host, hEpisodeId, 1, { segmentId: hSegmentId, timecode: '00:01:00;02', body: 'Trim the head' })).id;
  });

  it('for raw bodies and for bodies of the right shape', async () => {
    const ch = crew.channel.slug;
    const timecode = fc.oneof(fc.constantFrom('00:01:00;02', '00:01:00;00', '00:10:00;00', '23:59:59;29', '24:00:00;00', '1:2:3:4', '00:00:00:30', ''), fc.string({ maxLength: 24 }));
    const raw: ShapedRun[] = [
      ['lock', handoffsRoute.POST, 'POST', { channel: ch, episodeId: hEpisodeId }, fc.jsonValue()],
      ['edit stage', editStageRoute.PUT, 'PUT', { channel: ch, episodeId: hEpisodeId }, nearMiss],
      ['note', versionNotesRoute.POST, 'POST', { channel: ch, episodeId: hEpisodeId, version: '1' }, nearMiss],
      ['reply', noteRepliesRoute.POST, 'POST', { channel: ch, noteId }, nearMiss],
      ['resolve', noteRoute.PATCH, 'PATCH', { channel: ch, noteId }, nearMiss],
    ];
    await assertNo500(raw, 30);
    const shaped: ShapedRun[] = [
      ['lock', handoffsRoute.POST, 'POST', { channel: ch, episodeId: hEpisodeId }, fc.record({ note: fc.oneof(fc.string({ maxLength: 2100 }), fc.integer()) }, { requiredKeys: [] })],
      ['edit stage', editStageRoute.PUT, 'PUT', { channel: ch, episodeId: hEpisodeId }, fc.record({ stage: fc.constantFrom('assembly', 'rough_cut', 'picture_lock', 'final', '') })],
      [
        'note',
        versionNotesRoute.POST,
        'POST',
        { channel: ch, episodeId: hEpisodeId, version: '1' },
        fc.record(
          { segmentId: fc.oneof(fc.constant(hSegmentId), fc.uuid(), fc.constant('x')), clipId: fc.oneof(fc.uuid(), fc.constant('')), timecode, body: fc.string({ maxLength: 4100 }) },
          { requiredKeys: [] },
        ),
      ],
      ['reply', noteRepliesRoute.POST, 'POST', { channel: ch, noteId }, fc.record({ body: fc.oneof(fc.string({ maxLength: 4100 }), fc.constant('  ')) }, { requiredKeys: [] })],
      ['resolve', noteRoute.PATCH, 'PATCH', { channel: ch, noteId }, fc.record({ resolved: fc.oneof(fc.boolean(), fc.constant('yes'), fc.constant(null)) }, { requiredKeys: [] })],
    ];
    await assertNo500(shaped, 40);
  });
});
