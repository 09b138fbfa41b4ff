import { describe, expect, it } from 'vitest';
import type { RunningOrderDto, SegmentDto } from './schemas';
import { afterIdFor, moveAfter, moveInList, reorderRunningOrder } from './order';

describe('moveInList', () => {
  const ids = ['a', 'b', 'c', 'd'];

  it('moves an item down and up', () => {
    expect(moveInList(ids, 0, 2)).toEqual(['b', 'c', 'a', 'd']);
    expect(moveInList(ids, 3, 0)).toEqual(['d', 'a', 'b', 'c']);
    expect(moveInList(ids, 1, 3)).toEqual(['a', 'c', 'd', 'b']);
  });

  it('returns an unchanged copy for a move onto itself or out of range', () => {
    for (const [from, to] of [[1, 1], [-1, 2], [0, 4], [4, 0], [0.5, 1]] as const) {
      const out = moveInList(ids, from, to);
      expect(out).toEqual(ids);
      expect(out).not.toBe(ids);
    }
  });

  it('leaves the input alone', () => {
    const input = ['a', 'b', 'c'];
    moveInList(input, 0, 2);
    expect(input).toEqual(['a', 'b', 'c']);
  });
});

describe('afterIdFor', () => {
  it('names the id just before the moved one, or null when it is first', () => {
    expect(afterIdFor(['b', 'a', 'c'], 'b')).toBeNull();
    expect(afterIdFor(['b', 'a', 'c'], 'a')).toBe('b');
    expect(afterIdFor(['b', 'a', 'c'], 'c')).toBe('a');
  });

  it('refuses an id that is not in the order', () => {
    expect(() => afterIdFor(['a'], 'z')).toThrow(RangeError);
  });

  it('round-trips with moveAfter for every move in a list', () => {
    const items = ['a', 'b', 'c', 'd', 'e'].map((id) => ({ id }));
    const ids = items.map((s) => s.id);
    for (let from = 0; from < ids.length; from++) {
      for (let to = 0; to < ids.length; to++) {
        const expected = moveInList(ids, from, to);
        const moved = ids[from] as string;
        const afterId = afterIdFor(expected, moved);
        expect(moveAfter(items, moved, afterId).map((s) => s.id)).toEqual(expected);
      }
    }
  });
});

describe('moveAfter', () => {
  const items = ['a', 'b', 'c'].map((id) => ({ id }));
  const ids = (list: { id: string }[]) => list.map((s) => s.id);

  it('puts the item first for null and after the named one otherwise', () => {
    expect(ids(moveAfter(items, 'c', null))).toEqual(['c', 'a', 'b']);
    expect(ids(moveAfter(items, 'a', 'c'))).toEqual(['b', 'c', 'a']);
    expect(ids(moveAfter(items, 'a', 'b'))).toEqual(['b', 'a', 'c']);
  });

  it('changes nothing for unknown ids or a move after itself', () => {
    expect(ids(moveAfter(items, 'z', null))).toEqual(['a', 'b', 'c']);
    expect(ids(moveAfter(items, 'a', 'z'))).toEqual(['a', 'b', 'c']);
    expect(ids(moveAfter(items, 'b', 'b'))).toEqual(['a', 'b', 'c']);
  });
});

describe('reorderRunningOrder', () => {
  const segment = (id: string, wordCount: number, actionSeconds: number): SegmentDto => ({
    id,
    episodeId: 'e',
    position: id,
    kind: 'interlude',
    level: null,
    title: id,
    hasScript: wordCount > 0,
    wordCount,
    actionSeconds,
    scriptVersion: 1,
  });
  const segments = [segment('a', 150, 0), segment('b', 0, 30), segment('c', 75, 10)];
  const board = {
    episode: {} as RunningOrderDto['episode'],
    segments,
    forecast: { segments: [], totalSeconds: 0 },
    speakingRateWpm: 150,
    canEdit: true,
    shotProgress: {},
    changedSinceApproval: [],
  } satisfies RunningOrderDto;

  it('reorders segments and recomputes start times at the speaking rate', () => {
    const next = reorderRunningOrder(board, 'c', null);
    expect(next.segments.map((s) => s.id)).toEqual(['c', 'a', 'b']);
    // 75 words at 150 wpm = 30 s + 10 s action; 150 words = 60 s; then 30 s of action.
    expect(next.forecast.segments.map((f) => [f.id, f.startSeconds, f.totalSeconds])).toEqual([
      ['c', 0, 40],
      ['a', 40, 60],
      ['b', 100, 30],
    ]);
    expect(next.forecast.totalSeconds).toBe(130);
  });

  it('does not touch the board it was given', () => {
    reorderRunningOrder(board, 'a', 'c');
    expect(board.segments.map((s) => s.id)).toEqual(['a', 'b', 'c']);
    expect(board.forecast.totalSeconds).toBe(0);
  });
});
