import { forecastEpisode } from '@/lib/runtime';
import type { RunningOrderDto, SegmentDto } from './schemas';

/** A copy of `list` with the item at fromIndex taken out and put back at toIndex. Out-of-range indexes change nothing. */
export function moveInList<T>(list: readonly T[], fromIndex: number, toIndex: number): T[] {
  const out = [...list];
  const inRange = (i: number) => Number.isInteger(i) && i >= 0 && i < out.length;
  if (!inRange(fromIndex) || !inRange(toIndex) || fromIndex === toIndex) return out;
  const [item] = out.splice(fromIndex, 1) as [T];
  out.splice(toIndex, 0, item);
  return out;
}

/** The id just before movedId in the new order, which is what the position route asks for; null when it is first. */
export function afterIdFor(orderedIds: readonly string[], movedId: string): string | null {
  const index = orderedIds.indexOf(movedId);
  if (index < 0) throw new RangeError(`${movedId} is not in the running order`);
  return index === 0 ? null : (orderedIds[index - 1] ?? null);
}

/**
 * The same move the position route makes: movedId goes just after afterId (null = first).
 * Unknown ids change nothing, so a stale optimistic update cannot drop or duplicate a segment.
 */
export function moveAfter<T extends { id: string }>(items: readonly T[], movedId: string, afterId: string | null): T[] {
  const moved = items.find((s) => s.id === movedId);
  if (!moved || afterId === movedId) return [...items];
  const rest = items.filter((s) => s.id !== movedId);
  if (afterId === null) return [moved, ...rest];
  const at = rest.findIndex((s) => s.id === afterId);
  if (at < 0) return [...items];
  return [...rest.slice(0, at + 1), moved, ...rest.slice(at + 1)];
}

/** The runningOrder with its segments in a new order and the forecast recomputed, so start times follow at once. */
export function reorderRunningOrder(runningOrder: RunningOrderDto, movedId: string, afterId: string | null): RunningOrderDto {
  return withSegments(runningOrder, moveAfter(runningOrder.segments, movedId, afterId));
}

function withSegments(runningOrder: RunningOrderDto, segments: SegmentDto[]): RunningOrderDto {
  const forecast = forecastEpisode(
    segments.map((s) => ({ id: s.id, wordCount: s.wordCount, actionSeconds: s.actionSeconds })),
    runningOrder.speakingRateWpm,
  );
  return { ...runningOrder, segments, forecast };
}
