import type { QueryClient, QueryKey } from '@tanstack/react-query';

/** What a move replaced in the cache: each touched query's key and its data before the move. */
export type CacheSnapshot = [QueryKey, unknown][];

/** One cached view a move changes: the query under `queryKey` (with `exact: false`, every query below it). */
export type CachedView<V> = { cancel: (qc: QueryClient) => void; write: (qc: QueryClient, variables: V) => CacheSnapshot };

export function cachedView<T, V>(queryKey: QueryKey, update: (current: T, variables: V) => T, { exact = true }: { exact?: boolean } = {}): CachedView<V> {
  return {
    cancel: (qc) => void qc.cancelQueries({ queryKey, exact }),
    write: (qc, variables) => {
      const before = qc.getQueriesData<T>({ queryKey, exact });
      for (const [key, data] of before) if (data !== undefined) qc.setQueryData<T>(key, update(data, variables));
      return before;
    },
  };
}

/**
 * The optimistic part of every move or reorder mutation (running order, shot list, shop board): the
 * cached views take the change at once and go back if the server refuses; with several moves in flight
 * only the last one refetches, so an early answer cannot undo a later move.
 *
 * onMutate stays synchronous on purpose: the cache must hold the new order before React paints the
 * drop, otherwise the item jumps back to its old place for a frame. Cancelling first (it reverts
 * synchronously) stops a refetch in flight from overwriting the optimistic order. A caller that must
 * write in the same tick as the drop (TanStack calls onMutate a tick later) calls `apply` itself and
 * `restore` on failure instead of spreading onMutate/onError.
 */
export function optimisticMove<V>(qc: QueryClient, { views, mutationKey, refresh }: { views: CachedView<V>[]; mutationKey: QueryKey; refresh: () => Promise<unknown> }) {
  const apply = (variables: V): CacheSnapshot => {
    for (const view of views) view.cancel(qc);
    return views.flatMap((view) => view.write(qc, variables));
  };
  const restore = (snapshot: CacheSnapshot) => {
    for (const [key, data] of snapshot) if (data !== undefined) qc.setQueryData(key, data);
  };
  return {
    apply,
    restore,
    handlers: {
      mutationKey,
      onMutate: (variables: V) => ({ previous: apply(variables) }),
      onError: (_error: Error, _variables: V, context: { previous: CacheSnapshot } | undefined) => {
        if (context) restore(context.previous);
      },
      // Returning the refetch keeps the mutation pending until fresh data is in, so buttons do not
      // re-enable over stale items.
      onSettled: () => {
        if (qc.isMutating({ mutationKey }) > 1) return;
        return refresh();
      },
    },
  };
}

/** optimisticMove for one cached list (a reorder, a removal that renumbers): spread the result into useMutation's options. */
export function optimisticReorder<T, V>(
  qc: QueryClient,
  { key, mutationKey, reorder, refresh }: { key: QueryKey; mutationKey: QueryKey; reorder: (current: T, variables: V) => T; refresh: () => Promise<unknown> },
) {
  return optimisticMove<V>(qc, { views: [cachedView<T, V>(key, reorder)], mutationKey, refresh }).handlers;
}
