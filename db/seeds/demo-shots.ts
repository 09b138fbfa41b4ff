import { generateNKeysBetween } from 'fractional-indexing';
import type { Knex } from 'knex';
import type { Camera, Framing, ShotState } from '../../lib/shots/catalog';
import type { Tool } from '../../lib/safety/tools';

type DemoShot = { framing: Framing; camera: Camera; description: string; toShop?: boolean; state?: ShotState; reason?: string };
type DemoSegmentShots = { title: string; tools: Tool[]; reviewed: boolean; shots: DemoShot[] };

// Invented shot lists for the demo episode; the shop hand holds most of the build shots.
const plan: DemoSegmentShots[] = [
  {
    title: 'Cold open: three stools on the bench',
    tools: [],
    reviewed: false,
    shots: [
      { framing: 'wide', camera: 'a_cam', description: 'Three finished stools in a row, slow push in', state: 'captured' },
      { framing: 'close_up', camera: 'b_cam', description: 'Host’s hand on each seat in turn' },
    ],
  },
  {
    title: 'Starter: pocket-screwed pine stool',
    tools: ['miter_saw', 'drill_driver', 'sander'],
    reviewed: true,
    shots: [
      { framing: 'wide', camera: 'a_cam', description: 'Crosscut the legs to length at the miter saw', toShop: true, state: 'captured' },
      { framing: 'close_up', camera: 'b_cam', description: 'Pocket-hole jig clamped on the apron', toShop: true },
      { framing: 'overhead', camera: 'top_cam', description: 'Dry fit of the base, square checked corner to corner', toShop: true, state: 'retake', reason: 'Top cam out of focus' },
      { framing: 'insert', camera: 'phone', description: 'Glue squeeze-out wiped with a damp rag', toShop: true },
    ],
  },
  {
    title: 'Intermediate: doweled ash stool',
    tools: ['table_saw', 'drill_driver', 'chisels'],
    reviewed: false,
    shots: [
      { framing: 'medium', camera: 'a_cam', description: 'Rip the leg blanks, guard and riving knife in frame', toShop: true },
      { framing: 'extreme_close_up', camera: 'b_cam', description: 'Dowel centres tapped into the apron ends', toShop: true },
      { framing: 'pov', camera: 'phone', description: 'Drilling the dowel holes with a self-centring jig' },
    ],
  },
  {
    title: 'Advanced: wedged through-tenon oak stool',
    tools: ['bandsaw', 'router', 'chisels', 'finishes'],
    reviewed: false,
    shots: [
      { framing: 'close_up', camera: 'a_cam', description: 'Knife the tenon shoulders' },
      { framing: 'medium', camera: 'b_cam', description: 'Kerf the tenons for the wedges at the bandsaw', toShop: true },
      { framing: 'overhead', camera: 'top_cam', description: 'Oil finish wiped on; rags laid flat outdoors to dry' },
    ],
  },
];

export async function seedDemoShots(trx: Knex.Transaction, channelId: string): Promise<void> {
  const episode = await trx('episodes').where({ channel_id: channelId, title: 'One Stool, Three Ways' }).first('id', 'shoot_date');
  if (!episode) return;
  const crew: { user_id: string; role: string }[] = await trx('memberships').where({ channel_id: channelId }).select('user_id', 'role');
  const host = crew.find((m) => m.role === 'host')?.user_id ?? null;
  const shop = crew.find((m) => m.role === 'shop_hand')?.user_id ?? null;
  const total = plan.reduce((n, p) => n + p.shots.length, 0);
  const boardKeys = generateNKeysBetween(null, null, total);
  let b = 0;
  for (const item of plan) {
    const segment = await trx('segments').where({ episode_id: episode.id, title: item.title }).first('id');
    if (!segment) continue;
    await trx('segments')
      .where({ id: segment.id })
      .update({ tools: JSON.stringify(item.tools), ...(item.reviewed && { safety_reviewed_by: host, safety_reviewed_at: trx.fn.now() }) });
    const keys = generateNKeysBetween(null, null, item.shots.length);
    const rows = item.shots.map((s, i) => ({
      segment_id: segment.id,
      position: keys[i],
      board_position: boardKeys[b++],
      framing: s.framing,
      camera: s.camera,
      description: s.description,
      assignee_id: s.toShop ? shop : host,
      due_date: episode.shoot_date,
      state: s.state ?? 'planned',
      retake_reason: s.reason ?? null,
      ...(s.state && { state_changed_by: shop ?? host, state_changed_at: trx.fn.now() }),
    }));
    const inserted: { id: string; position: string; assignee_id: string | null; due_date: string | null }[] = await trx('shots')
      .insert(rows)
      .returning(['id', 'position', 'assignee_id', 'due_date']);
    // A seeded state has its history row, as a change made in the app would.
    const events = inserted.flatMap((r) => {
      const s = item.shots[keys.indexOf(r.position)];
      return s?.state ? [{ shot_id: r.id, from_state: 'planned', to_state: s.state, reason: s.reason ?? null, user_id: shop ?? host }] : [];
    });
    if (events.length) await trx('shot_events').insert(events);
    // The seeded crew "already knows" its shots, so the first e-mail they get is about a real change.
    const notices = inserted.filter((r) => r.assignee_id).map((r) => ({ shot_id: r.id, user_id: r.assignee_id, due_date: r.due_date }));
    if (notices.length) await trx('shot_notices').insert(notices);
  }
}
