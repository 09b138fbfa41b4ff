'use client';

import {
  closestCenter,
  DndContext,
  DragOverlay,
  type Announcements,
  type DragEndEvent,
  type DragStartEvent,
  type Modifier,
  type ScreenReaderInstructions,
  type UniqueIdentifier,
} from '@dnd-kit/core';
import { SortableContext, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { useMemo, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { useSortableList } from '@/components/ui/use-sortable-list';
import type { RunningOrderDto } from '@/lib/segments/schemas';
import { AddSegmentForm } from './add-segment-form';
import { RuntimeBar } from './runtime-bar';
import { SegmentCardPreview, SortableSegmentItem, StaticSegmentItem } from './segment-card';
import { useRunningOrder, useMoveSegment } from './use-running-order';

// A running order is one column: sideways movement only makes the card wander.
const verticalOnly: Modifier = ({ transform }) => ({ ...transform, x: 0 });

const screenReaderInstructions: ScreenReaderInstructions = {
  draggable:
    'To move a segment, press Space or Enter on its move handle, use the Up and Down arrow keys to choose a new position, then press Space or Enter to drop it, or Escape to cancel. On a touch screen, press and hold the handle, then drag.',
};

export function RunningOrderList({ channelSlug, initialRunningOrder }: { channelSlug: string; initialRunningOrder: RunningOrderDto }) {
  const { data: runningOrder } = useRunningOrder(channelSlug, initialRunningOrder);
  const { episode, segments, forecast, canEdit } = runningOrder;
  const move = useMoveSegment(channelSlug, episode.id);
  const [activeId, setActiveId] = useState<string | null>(null);
  const [deletedTitle, setDeletedTitle] = useState<string | null>(null);
  const headingRef = useRef<HTMLHeadingElement>(null);
  const ids = useMemo(() => segments.map((s) => s.id), [segments]);
  const { dndId, sensors, dropOf, noteStart, overChanged } = useSortableList(ids);
  const forecastById = new Map(forecast.segments.map((f) => [f.id, f]));
  const count = ids.length;
  const titleOf = (id: UniqueIdentifier) => segments.find((s) => s.id === id)?.title ?? 'The segment';
  const positionOf = (id: UniqueIdentifier) => ids.indexOf(String(id)) + 1;
  const at = (id: UniqueIdentifier) => `position ${positionOf(id)} of ${count}`;

  const announcements: Announcements = {
    onDragStart: ({ active }) => {
      noteStart(active.id);
      return `Picked up ${titleOf(active.id)}, ${at(active.id)}.`;
    },
    onDragOver: ({ active, over }) => {
      // Picking up does not also announce "moved".
      if (!overChanged(over?.id ?? null)) return undefined;
      return over
        ? `${titleOf(active.id)} moved to ${at(over.id)}.`
        : `${titleOf(active.id)} is no longer over a position in the running order.`;
    },
    onDragEnd: ({ active, over }) =>
      over
        ? `${titleOf(active.id)} dropped at ${at(over.id)}.`
        : `${titleOf(active.id)} dropped outside the running order. It stays at ${at(active.id)}.`,
    onDragCancel: ({ active }) => `Moving ${titleOf(active.id)} was cancelled. It stays at ${at(active.id)}.`,
  };

  function onDragStart({ active }: DragStartEvent) {
    setActiveId(String(active.id));
    setDeletedTitle(null);
  }

  function onDragEnd(event: DragEndEvent) {
    setActiveId(null);
    const drop = dropOf(event);
    if (!drop) return;
    // Called in the same event as setActiveId(null): the optimistic order lands in the same render as the drop.
    move.mutate({ segmentId: drop.id, afterId: drop.afterId, title: titleOf(drop.id) });
  }

  function onDeleted(title: string) {
    setDeletedTitle(title);
    // The card that held focus is gone; the list heading is the nearest stable place.
    headingRef.current?.focus();
  }

  const active = activeId ? segments.find((s) => s.id === activeId) : undefined;
  const changedIds = new Set(runningOrder.changedSinceApproval);
  const itemProps = (segmentId: string, index: number) => ({
    channelSlug,
    episode,
    forecast: forecastById.get(segmentId),
    shotProgress: runningOrder.shotProgress[segmentId],
    changedSinceApproval: changedIds.has(segmentId),
    position: index + 1,
  });

  return (
    <div className="space-y-6">
      {count > 0 ? <RuntimeBar segments={segments} forecast={forecast} targetSeconds={episode.targetSeconds} /> : null}

      <section aria-labelledby="running-order-heading" className="space-y-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="running-order-heading" ref={headingRef} tabIndex={-1} className="text-lg font-bold">
            Running order
          </h2>
          {count > 0 ? (
            <p className="text-sm text-ink-soft">
              {count} {count === 1 ? 'segment' : 'segments'}
            </p>
          ) : null}
        </div>

        {!canEdit ? (
          <p className="flex items-center gap-2 rounded-md border border-paper-edge bg-paper-deep/60 px-3 py-2 text-sm text-ink-soft">
            <LockIcon />
            Read-only: only a Host can change the running order.
          </p>
        ) : null}

        {move.isError ? (
          <Alert tone="attention">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span>
                Could not move {move.variables?.title ?? 'the segment'}: {move.error.message}
              </span>
              <Button variant="quiet" className="-my-2" onClick={() => move.reset()}>
                Dismiss
              </Button>
            </div>
          </Alert>
        ) : null}
        {deletedTitle ? <Alert tone="ok">Deleted {deletedTitle}.</Alert> : null}

        {count === 0 ? (
          <EmptyState title="No segments yet.">
            {canEdit
              ? 'Add the first segment below: a cold open, the build at each level, a sponsor read, an outro.'
              : 'A Host has not planned the running order of this episode yet.'}
          </EmptyState>
        ) : canEdit ? (
          <DndContext
            id={dndId}
            sensors={sensors}
            collisionDetection={closestCenter}
            modifiers={[verticalOnly]}
            accessibility={{ announcements, screenReaderInstructions }}
            onDragStart={onDragStart}
            onDragEnd={onDragEnd}
            onDragCancel={() => setActiveId(null)}
          >
            <SortableContext items={ids} strategy={verticalListSortingStrategy}>
              <ol className="space-y-2.5">
                {segments.map((segment, index) => (
                  <SortableSegmentItem key={segment.id} segment={segment} {...itemProps(segment.id, index)} onDeleted={onDeleted} />
                ))}
              </ol>
            </SortableContext>
            <DragOverlay>
              {active ? <SegmentCardPreview segment={active} {...itemProps(active.id, ids.indexOf(active.id))} /> : null}
            </DragOverlay>
          </DndContext>
        ) : (
          <ol className="space-y-2.5">
            {segments.map((segment, index) => (
              <StaticSegmentItem key={segment.id} segment={segment} {...itemProps(segment.id, index)} />
            ))}
          </ol>
        )}
      </section>

      {canEdit ? <AddSegmentForm channelSlug={channelSlug} episode={episode} /> : null}
    </div>
  );
}

function LockIcon() {
  return (
    <svg aria-hidden="true" width="14" height="14" viewBox="0 0 14 14" className="shrink-0">
      <rect x="2.5" y="6" width="9" height="6.5" rx="1" fill="none" stroke="currentColor" strokeWidth="1.4" />
      <path d="M4.5 6V4.5a2.5 2.5 0 0 1 5 0V6" fill="none" stroke="currentColor" strokeWidth="1.4" />
    </svg>
  );
}
