import { describe, expect, it } from 'vitest';
import * as cutSettingsRoute from '@/app/api/channels/[channel]/cut-settings/route';
import * as episodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/route';
import * as segmentRoute from '@/app/api/channels/[channel]/segments/[segmentId]/route';
import * as stateRoute from '@/app/api/channels/[channel]/shots/[shotId]/state/route';
import { db } from '@/db/client';
import { toAppError } from '@/lib/errors';
import { getCutSettings } from '@/lib/stock/queries';
import { makeEpisode, makeOutlinedEpisode } from './episode-fixtures';
import { createShot } from '@/lib/shots/queries';
import { call, makeCrew } from './helpers';
import type { Crew } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

// Issue 12, items 6 and 7: read-modify-write under parallel requests. Each case fires its requests
// at once and checks that no write was lost.

const ch = (c: Crew) => ({ channel: c.channel.slug });

describe('shot state changes in parallel', () => {
  it('drops none of 60 changes: the history is one unbroken chain and ends in the shot’s state', async () => {
    const c = await makeCrew();
    const { shopShot } = await makeShotEpisode(c);
    const params = { ...ch(c), shotId: shopShot.id };
    // Every retake carries its own reason, so each one is a change whatever came before it.
    const bodies = Array.from({ length: 60 }, (_, i) => (i % 3 === 0 ? { state: 'captured' } : { state: 'retake', reason: `Take ${i}` }));
    const answers = await Promise.all(bodies.map((body) => call(stateRoute.PUT, 'PUT', { as: c.shopHand, params, body })));
    expect(answers.map((a) => a.status)).toEqual(Array<number>(60).fill(200));

    const events: { from_state: string; to_state: string; reason: string | null }[] = await db('shot_events').where({ shot_id: shopShot.id }).orderBy('id');
    const reasons = events.map((e) => e.reason).filter((r): r is string => r !== null);
    expect(reasons.sort()).toEqual(bodies.flatMap((b) => (b.reason ? [b.reason] : [])).sort());
    expect(events[0]?.from_state).toBe('planned');
    events.slice(1).forEach((e, i) => expect(e.from_state, `event ${i + 1}`).toBe(events[i]?.to_state));
    const shot: { state: string; retake_reason: string | null } = await db('shots').where({ id: shopShot.id }).first('state', 'retake_reason');
    expect(shot.state).toBe(events.at(-1)?.to_state);
    expect(shot.retake_reason).toBe(events.at(-1)?.reason ?? null);
  });
});

describe('shop board order in parallel', () => {
  it('gives nine cards moved after card 0 at once nine different places', async () => {
    const c = await makeCrew();
    const { build, shopShot } = await makeShotEpisode(c);
    const cards = [];
    for (let i = 0; i < 9; i++) {
      cards.push(await createShot(c.channel.id, build.id, { description: `Card ${i + 1}`, framing: 'wide', camera: 'a_cam', assigneeId: null, dueDate: null, notes: '' }));
    }
    const answers = await Promise.all(
      cards.map((card) => call(stateRoute.PUT, 'PUT', { as: c.host, params: { ...ch(c), shotId: card.id }, body: { state: 'planned', afterId: shopShot.id } })),
    );
    expect(answers.map((a) => a.status)).toEqual(Array<number>(9).fill(200));
    const rows: { id: string; board_position: string }[] = await db('shots').where({ segment_id: build.id }).select('id', 'board_position');
    expect(new Set(rows.map((r) => r.board_position)).size).toBe(rows.length);
    const after = rows.find((r) => r.id === shopShot.id)?.board_position ?? '';
    for (const card of cards) expect((rows.find((r) => r.id === card.id)?.board_position ?? '') > after).toBe(true);
  });
});

describe('cut settings in parallel', () => {
  it('keeps every field of five single-field changes sent at once', async () => {
    for (let round = 0; round < 5; round++) {
      const c = await makeCrew();
      const bodies = [{ kerfIn: '3/32' }, { endTrimIn: '1/2' }, { minOffcutIn: '18' }, { jointIn: '1/8' }, { lengthUnit: 'mm' }];
      const answers = await Promise.all(bodies.map((body) => call(cutSettingsRoute.PATCH, 'PATCH', { as: c.host, params: ch(c), body })));
      expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200, 200]);
      expect(await getCutSettings(c.channel.id)).toEqual({ kerfIn: 0.09375, endTrimIn: 0.5, minOffcutIn: 18, jointIn: 0.125, lengthUnit: 'mm' });
    }
  });
});

describe('episode dates in parallel', () => {
  it('never leaves the shoot date after the publish date, and says which date is wrong', async () => {
    const c = await makeCrew();
    for (let round = 0; round < 8; round++) {
      const episode = await makeEpisode(c);
      const params = { ...ch(c), episodeId: episode.id };
      await call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { shootDate: '2027-01-10', publishDate: '2027-01-20' } });
      // Each is fine alone; together they would cross.
      const answers = await Promise.all([
        call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { shootDate: '2027-01-18' } }),
        call(episodeRoute.PATCH, 'PATCH', { as: c.host, params, body: { publishDate: '2027-01-12' } }),
      ]);
      expect(answers.map((a) => a.status).sort()).toEqual([200, 400]);
      expect(answers.find((a) => a.status === 400)?.json.error?.fields?.publishDate).toBeTruthy();
      const row: { shoot: string; publish: string } = await db('episodes').where({ id: episode.id }).first(db.raw('shoot_date::text as shoot'), db.raw('publish_date::text as publish'));
      expect(row.shoot <= row.publish).toBe(true);
    }
  });

  it('holds the rule in the database too, with the same clear message', async () => {
    const c = await makeCrew();
    const episode = await makeEpisode(c);
    const err = await db('episodes').where({ id: episode.id }).update({ shoot_date: '2027-02-02', publish_date: '2027-02-01' }).catch((e: unknown) => e);
    expect(toAppError(err)).toMatchObject({ code: 'invalid_input', fields: { publishDate: 'The publish date comes after the shoot date.' } });
  });
});

describe('segment kind and level in parallel', () => {
  it('never loses a kind change to a parallel level change, nor leaves a level on a non-Build', async () => {
    const c = await makeCrew();
    const builds = [];
    for (let i = 0; i < 3; i++) builds.push(...(await makeOutlinedEpisode(c)).segments.filter((s) => s.kind === 'build'));
    for (const build of builds) {
      const params = { ...ch(c), segmentId: build.id };
      const answers = await Promise.all([
        call(segmentRoute.PATCH, 'PATCH', { as: c.host, params, body: { kind: 'interlude' } }),
        call(segmentRoute.PATCH, 'PATCH', { as: c.host, params, body: { level: 3 } }),
      ]);
      expect(answers.every((a) => a.status === 200 || a.status === 400)).toBe(true);
      const row: { kind: string; level: number | null } = await db('segments').where({ id: build.id }).first('kind', 'level');
      if (row.kind !== 'build') expect(row.level).toBeNull();
      // Both can succeed only as "level, then kind"; the kind change must then be what is left.
      if (answers.every((a) => a.status === 200)) expect(row.kind).toBe('interlude');
    }
  });
});
