import type { QueryClient, QueryKey } from '@tanstack/react-query';

/**
 * The optimistic part of a reorder mutation, shared by the running order and the shot list: the
 * cached list takes the new order at once and goes back if the server refuses; with several moves in
 * flight only the last one refetches, so an early answer cannot undo a later move.
 *
 * onMutate stays synchronous on purpose: the cache must hold the new order before React paints the
 * drop, otherwise the item jumps back to its old place for a frame. Cancelling first (it reverts
 * synchronously) stops a refetch in flight from overwriting the optimistic order.
 */
export function optimisticReorder<T, V>(
  qc: QueryClient,
  { key, mutationKey, reorder, refresh }: { key: QueryKey; mutationKey: QueryKey; reorder: (current: T, variables: V) => T; refresh: () => Promise<unknown> },
) {
  return {
    mutationKey,
    onMutate: (variables: V) => {
      void qc.cancelQueries({ queryKey: key, exact: true });
      const previous = qc.getQueryData<T>(key);
      if (previous !== undefined) qc.setQueryData<T>(key, reorder(previous, variables));
      return { previous };
    },
    onError: (_error: Error, _variables: V, context: { previous: T | undefined } | undefined) => {
      if (context?.previous !== undefined) qc.setQueryData<T>(key, context.previous);
    },
    // Returning the refetch keeps the mutation pending until fresh data is in, so buttons do not
    // re-enable over stale items.
    onSettled: () => {
      if (qc.isMutating({ mutationKey }) > 1) return;
      return refresh();
    },
  };
}
