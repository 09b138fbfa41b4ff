import { describe, expect, it } from 'vitest';
import * as clipNotesRoute from '@/app/api/channels/[channel]/clips/[clipId]/notes/route';
import * as noteRoute from '@/app/api/channels/[channel]/edit-notes/[noteId]/route';
import * as noteRepliesRoute from '@/app/api/channels/[channel]/edit-notes/[noteId]/replies/route';
import * as editStageRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/edit-stage/route';
import * as versionNotesRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/handoffs/[version]/notes/route';
import * as episodeRoute from '@/app/api/channels/[channel]/episodes/[episodeId]/route';
import { createNote } from '@/lib/edit/queries';
import type { EditNoteDto, EditStageEventDto } from '@/lib/edit/schemas';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import { lockHandoff } from '@/lib/handoffs/queries';
import { hostMember, makeLockedEpisode, storeClip } from './handoff-fixtures';
import { call, makeCrew } from './helpers';
import { describeRouteMatrix, type Crew, type RouteCase } from './route-matrix';
import { makeShotEpisode } from './shot-fixtures';

const ch = (c: Crew) => ({ channel: c.channel.slug });

async function makeNote(c: Crew) {
  const ep = await makeLockedEpisode(c);
  const note = await createNote(await hostMember(c), c.host, ep.episode.id, 1, { segmentId: ep.build.id, timecode: '00:01:00;02', body: 'Tighten the cut' });
  return { ...ep, note };
}

// The matrix builds params before the body: the note POST's body names the segment its params made.
const segmentOf = new Map<string, string>();

const cases: RouteCase[] = [
  { name: 'GET edit stage history', fn: editStageRoute.GET, method: 'GET', allowed: ['host', 'shop_hand', 'editor'], params: async (c) => ({ ...ch(c), episodeId: (await makeShotEpisode(c)).episode.id }), okStatus: 200 },
  {
    name: 'PUT edit stage',
    fn: editStageRoute.PUT,
    method: 'PUT',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeShotEpisode(c)).episode.id }),
    body: () => ({ stage: 'rough_cut' }),
    badBody: { stage: 'final' },
    okStatus: 200,
  },
  {
    name: 'GET version notes',
    fn: versionNotesRoute.GET,
    method: 'GET',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), episodeId: (await makeLockedEpisode(c)).episode.id, version: '1' }),
    okStatus: 200,
  },
  {
    name: 'POST version note',
    fn: versionNotesRoute.POST,
    method: 'POST',
    allowed: ['host', 'editor'],
    params: async (c) => {
      const ep = await makeLockedEpisode(c);
      segmentOf.set(c.channel.id, ep.build.id);
      return { ...ch(c), episodeId: ep.episode.id, version: '1' };
    },
    body: (c) => ({ segmentId: segmentOf.get(c.channel.id), timecode: '00:00:10;00', body: 'Hold a beat longer' }),
    badBody: { timecode: '', body: '' },
    okStatus: 201,
  },
  {
    name: 'PATCH edit note (resolve)',
    fn: noteRoute.PATCH,
    method: 'PATCH',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), noteId: (await makeNote(c)).note.id }),
    body: () => ({ resolved: true }),
    badBody: { resolved: 'yes' },
    okStatus: 200,
  },
  {
    name: 'POST edit note reply',
    fn: noteRepliesRoute.POST,
    method: 'POST',
    allowed: ['host', 'editor'],
    params: async (c) => ({ ...ch(c), noteId: (await makeNote(c)).note.id }),
    body: () => ({ body: 'Done in v2' }),
    badBody: { body: '   ' },
    okStatus: 201,
  },
  {
    name: 'GET clip notes (the shop hand’s own clip)',
    fn: clipNotesRoute.GET,
    method: 'GET',
    allowed: ['host', 'shop_hand', 'editor'],
    params: async (c) => ({ ...ch(c), clipId: (await makeLockedEpisode(c)).clip.clipId }),
    okStatus: 200,
  },
];

describeRouteMatrix(cases);

describe('edit notes', () => {
  it('pins a note at 00:01:00;02 on a 29.97 DF episode to frame 1800 and reads it back', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const params = { ...ch(c), episodeId: ep.episode.id, version: '1' };
    const res = await call(versionNotesRoute.POST, 'POST', { as: c.editor, params, body: { segmentId: ep.build.id, timecode: '00:01:00;02', body: 'Cut on the blade stop' } });
    expect(res.status).toBe(201);
    const note = (res.json as { note: EditNoteDto }).note;
    expect(note).toMatchObject({ frame: 1800, timecode: '00:01:00;02', author: c.editor.name, version: 1, resolvedAt: null });
  });

  it('refuses a drop-frame label that does not exist, and a segment not in the version, with fields', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const params = { ...ch(c), episodeId: ep.episode.id, version: '1' };
    const skipped = await call(versionNotesRoute.POST, 'POST', { as: c.editor, params, body: { segmentId: ep.build.id, timecode: '00:01:00;00', body: 'x' } });
    expect(skipped.status).toBe(400);
    expect(skipped.json.error?.fields?.timecode).toMatch(/skipped/);
    const stranger = await call(versionNotesRoute.POST, 'POST', { as: c.editor, params, body: { segmentId: ep.clip.clipId, timecode: '00:00:01;00', body: 'x' } });
    expect(stranger.status).toBe(400);
    expect(stranger.json.error?.fields?.segmentId).toBeTruthy();
  });

  it('threads replies, resolves and reopens with who and when', async () => {
    const c = await makeCrew();
    const { note, episode } = await makeNote(c);
    await call(noteRepliesRoute.POST, 'POST', { as: c.editor, params: { ...ch(c), noteId: note.id }, body: { body: 'Which take?' } });
    const resolved = await call(noteRoute.PATCH, 'PATCH', { as: c.editor, params: { ...ch(c), noteId: note.id }, body: { resolved: true } });
    expect((resolved.json as { note: EditNoteDto }).note).toMatchObject({ resolvedBy: c.editor.name });
    const list = await call(versionNotesRoute.GET, 'GET', { as: c.host, params: { ...ch(c), episodeId: episode.id, version: '1' } });
    const threads = (list.json as { notes: EditNoteDto[] }).notes;
    expect(threads).toHaveLength(1);
    expect(threads[0]!.replies.map((r) => r.body)).toEqual(['Which take?']);
    const reopened = await call(noteRoute.PATCH, 'PATCH', { as: c.host, params: { ...ch(c), noteId: note.id }, body: { resolved: false } });
    expect((reopened.json as { note: EditNoteDto }).note).toMatchObject({ resolvedAt: null, resolvedBy: null });
  });

  it('lets a Shop hand read notes on clips they uploaded, not on others’', async () => {
    const c = await makeCrew();
    const ep = await makeLockedEpisode(c);
    const hostClip = await storeClip(ep.build.id, null, c.host.id, 'host.mp4');
    await lockHandoff(await hostMember(c), c.host, ep.episode.id, { note: '' });
    await createNote(await hostMember(c), c.host, ep.episode.id, 2, { clipId: ep.clip.clipId, timecode: '00:00:02;00', body: 'Soft focus at the start' });
    const own = await call(clipNotesRoute.GET, 'GET', { as: c.shopHand, params: { ...ch(c), clipId: ep.clip.clipId } });
    expect((own.json as { notes: EditNoteDto[] }).notes.map((n) => n.body)).toEqual(['Soft focus at the start']);
    const other = await call(clipNotesRoute.GET, 'GET', { as: c.shopHand, params: { ...ch(c), clipId: hostClip.clipId } });
    expect(other.status).toBe(403);
  });
});

describe('edit stage', () => {
  it('keeps history and shows on the episode', async () => {
    const c = await makeCrew();
    const { episode } = await makeShotEpisode(c);
    const params = { ...ch(c), episodeId: episode.id };
    await call(editStageRoute.PUT, 'PUT', { as: c.editor, params, body: { stage: 'assembly' } });
    await call(editStageRoute.PUT, 'PUT', { as: c.host, params, body: { stage: 'rough_cut' } });
    const history = (await call(editStageRoute.GET, 'GET', { as: c.shopHand, params })).json as { history: EditStageEventDto[] };
    expect(history.history.map((h) => [h.fromStage, h.toStage, h.by])).toEqual([
      ['assembly', 'rough_cut', c.host.name],
      [null, 'assembly', c.editor.name],
    ]);
    const ep = (await call(episodeRoute.GET, 'GET', { as: c.editor, params })).json as { episode: EpisodeDto };
    expect(ep.episode.editStage).toBe('rough_cut');
    expect(ep.episode.frameRate).toBe('29.97df');
  });
});
