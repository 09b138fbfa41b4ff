import { describe, expect, it } from 'vitest';
import * as stateRoute from '@/app/api/channels/[channel]/shots/[shotId]/state/route';
import { db } from '@/db/client';
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
