import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it, vi } from 'vitest';
import { optimisticReorder } from './optimistic';

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
    expect(context.previous).toEqual(['a', 'b', 'c']);
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
    expect(onMutate('a').previous).toBeUndefined();
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
