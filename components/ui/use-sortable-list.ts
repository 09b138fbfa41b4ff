'use client';

import { KeyboardSensor, PointerSensor, TouchSensor, useSensor, useSensors, type DragEndEvent, type UniqueIdentifier } from '@dnd-kit/core';
import { sortableKeyboardCoordinates } from '@dnd-kit/sortable';
import { useId, useRef } from 'react';
import { afterIdFor, moveInList } from '@/lib/segments/order';

/** Mouse, touch and keyboard, the same on every sortable list and the shop board. */
export function useSortableSensors() {
  return useSensors(
    // A few pixels of travel before a drag starts, so a click on the handle stays a click.
    useSensor(PointerSensor, { activationConstraint: { distance: 6 } }),
    useSensor(TouchSensor, { activationConstraint: { delay: 150, tolerance: 5 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
}

/**
 * What the single-column drag-and-drop lists (running order, shot list) share: the DndContext id
 * (`useId` avoids a hydration mismatch), the sensors, where a drop puts an item, and the guard that
 * keeps a pick-up from also being announced as a move.
 */
export function useSortableList(ids: readonly string[]) {
  const dndId = useId();
  const sensors = useSortableSensors();
  // The drop target the screen reader last heard about.
  const announcedOver = useRef<UniqueIdentifier | null>(null);

  /** The moved item, the item it now follows (null: first) and its old index; null when nothing moved. */
  function dropOf({ active, over }: Pick<DragEndEvent, 'active' | 'over'>): { id: string; afterId: string | null; from: number } | null {
    if (!over || active.id === over.id) return null;
    const from = ids.indexOf(String(active.id));
    const to = ids.indexOf(String(over.id));
    if (from < 0 || to < 0) return null;
    const id = String(active.id);
    return { id, afterId: afterIdFor(moveInList(ids, from, to), id), from };
  }

  /** Call from onDragStart's announcement: the item starts over itself. */
  const noteStart = (id: UniqueIdentifier) => {
    announcedOver.current = id;
  };

  /** For onDragOver's announcement: true only when the target differs from the last one announced. */
  const overChanged = (overId: UniqueIdentifier | null) => {
    if (overId === announcedOver.current) return false;
    announcedOver.current = overId;
    return true;
  };

  return { dndId, sensors, dropOf, noteStart, overChanged };
}
