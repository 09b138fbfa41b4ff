import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it, vi } from 'vitest';
import { cachedView, optimisticMove, optimisticReorder } from './optimistic';

const key = ['list'];
const moveToFront = (list: string[], id: string) => [id, ...list.filter((x) => x !== id)];

function setUp() {
  const qc = new QueryClient();
  qc.setQueryData(key, ['a', 'b', 'c']);
  const refresh = vi.fn(async () => undefined);
  const handlers = optimisticReorder<string[], string>(qc, { key, mutationKey: ['move'], reorder: moveToFront, refresh });
  return { qc, refresh, handlers };
}

describe('optimisticReorder', () => {
  it('puts the new order in the cache at once, synchronously', () => {
    const { qc, handlers } = setUp();
    const context = handlers.onMutate('c');
    expect(qc.getQueryData(key)).toEqual(['c', 'a', 'b']);
    expect(context.previous).toEqual([[key, ['a', 'b', 'c']]]);
  });

  it('puts the old order back when the server refuses', () => {
    const { qc, handlers } = setUp();
    const context = handlers.onMutate('c');
    handlers.onError(new Error('refused'), 'c', context);
    expect(qc.getQueryData(key)).toEqual(['a', 'b', 'c']);
  });

  it('leaves an empty cache alone', () => {
    const qc = new QueryClient();
    const { onMutate } = optimisticReorder<string[], string>(qc, { key, mutationKey: ['move'], reorder: moveToFront, refresh: async () => undefined });
    expect(onMutate('a').previous).toEqual([]);
    expect(qc.getQueryData(key)).toBeUndefined();
  });

  it('refetches when the last move settles, and not while another is still in flight', async () => {
    const { qc, refresh, handlers } = setUp();
    await handlers.onSettled();
    expect(refresh).toHaveBeenCalledTimes(1);
    // Two moves still running (this one settling and a later one): the later one will refetch.
    const spy = vi.spyOn(qc, 'isMutating').mockReturnValue(2);
    await handlers.onSettled();
    expect(refresh).toHaveBeenCalledTimes(1);
    expect(spy).toHaveBeenCalledWith({ mutationKey: ['move'] });
  });
});

describe('optimisticMove', () => {
  const boardKey = ['board'];
  const byCase = (list: string[], id: string) => list.map((x) => (x === id ? x.toUpperCase() : x));

  it('changes every cached view at once, the prefix ones included, and puts each back on refusal', () => {
    const qc = new QueryClient();
    qc.setQueryData([...boardKey, 'all'], ['a', 'b']);
    qc.setQueryData([...boardKey, 'mine'], ['b']);
    qc.setQueryData(['mine'], ['c', 'b']);
    const move = optimisticMove<string>(qc, {
      views: [cachedView<string[], string>(boardKey, byCase, { exact: false }), cachedView<string[], string>(['mine'], moveToFront)],
      mutationKey: ['state'],
      refresh: async () => undefined,
    });
    const snapshot = move.apply('b');
    expect(qc.getQueryData([...boardKey, 'all'])).toEqual(['a', 'B']);
    expect(qc.getQueryData([...boardKey, 'mine'])).toEqual(['B']);
    expect(qc.getQueryData(['mine'])).toEqual(['b', 'c']);
    move.restore(snapshot);
    expect(qc.getQueryData([...boardKey, 'all'])).toEqual(['a', 'b']);
    expect(qc.getQueryData([...boardKey, 'mine'])).toEqual(['b']);
    expect(qc.getQueryData(['mine'])).toEqual(['c', 'b']);
  });

  it('leaves views it does not name alone', () => {
    const qc = new QueryClient();
    qc.setQueryData(['other'], ['b']);
    optimisticMove<string>(qc, { views: [cachedView<string[], string>(boardKey, byCase, { exact: false })], mutationKey: ['state'], refresh: async () => undefined }).apply('b');
    expect(qc.getQueryData(['other'])).toEqual(['b']);
  });
});
