'use client';

import {
  closestCenter,
  DndContext,
  DragOverlay,
  getFirstCollision,
  pointerWithin,
  rectIntersection,
  type Announcements,
  type CollisionDetection,
  type DragEndEvent,
  type DragOverEvent,
  type DragStartEvent,
  type ScreenReaderInstructions,
  type UniqueIdentifier,
} from '@dnd-kit/core';
import { arrayMove } from '@dnd-kit/sortable';
import { useSortableSensors } from '@/components/ui/use-sortable-list';
import { useCallback, useEffect, useId, useMemo, useRef, useState } from 'react';
import { shotStateLabels, shotStates, type ShotState } from '@/lib/shots/catalog';
import type { BoardShotDto } from '@/lib/shots/schemas';
import { columnId, DroppableColumn, StaticColumn } from './board-column';
import { ShotCardPreview, SortableShotCard, StaticShotCard } from './shot-card';
import type { StateChange } from './use-shop-board';

type Columns = Record<ShotState, string[]>;

const columnsOf = (shots: BoardShotDto[]): Columns => {
  const out: Columns = { planned: [], captured: [], retake: [] };
  for (const s of shots) out[s.state].push(s.id);
  return out;
};

const stateOfColumn = (id: UniqueIdentifier): ShotState | undefined => shotStates.find((s) => columnId(s) === id);
const containerOf = (columns: Columns, id: UniqueIdentifier): ShotState | undefined =>
  stateOfColumn(id) ?? shotStates.find((s) => columns[s].includes(String(id)));

const screenReaderInstructions: ScreenReaderInstructions = {
  draggable:
    'To move a shot, press Space or Enter on its move handle. Use the Left and Right arrow keys to change column and Up and Down to change its place, then press Space or Enter to drop it, or Escape to cancel. On a touch screen, press and hold the handle, then drag.',
};

/** The server refuses Captured until the segment's tools are reviewed (lib/shots/queries.ts); the board refuses the drop first. */
const waitsForReview = (shot: BoardShotDto | undefined, state: ShotState) => state === 'captured' && !!shot?.safetyPending && shot.state !== 'captured';
const REVIEW_REFUSAL = 'Captured waits for the safety review of this segment’s tools; a Host can review it on the segment page.';

function focusHandleIfLost(shotId: string) {
  const current = document.activeElement;
  if (current && current !== document.body) return;
  document.querySelector<HTMLElement>(`[data-shot-handle="${shotId}"]`)?.focus({ preventScroll: true });
}

type Props = {
  slug: string;
  shots: BoardShotDto[];
  canMove: boolean;
  onMove: (change: StateChange) => void;
  /** Resolves when the reason dialog closes, whether the retake was saved or not. */
  askRetake: (shot: BoardShotDto, afterId: string | null) => Promise<void>;
};

export function DesktopBoard({ slug, shots, canMove, onMove, askRetake }: Props) {
  const byId = useMemo(() => new Map(shots.map((s) => [s.id, s])), [shots]);
  const settled = useMemo(() => columnsOf(shots), [shots]);
  // While dragging, the card's column follows the pointer; while the retake dialog is open it stays where it was dropped.
  const [dragging, setDragging] = useState<{ activeId: string; columns: Columns } | null>(null);
  // The query cache tells React about the optimistic move a tick after the drop; until then, or until the
  // retake dialog closes (`untilClosed`), the board keeps the dropped layout instead of flashing the old one.
  const [held, setHeld] = useState<{ columns: Columns; shots: BoardShotDto[]; untilClosed: boolean } | null>(null);
  if (held && !held.untilClosed && held.shots !== shots) setHeld(null);
  const columns = dragging?.columns ?? held?.columns ?? settled;
  const lastOverId = useRef<UniqueIdentifier | null>(null);
  const movedToNewColumn = useRef(false);
  const dndId = useId();

  const sensors = useSortableSensors();

  useEffect(() => {
    requestAnimationFrame(() => {
      movedToNewColumn.current = false;
    });
  }, [columns]);

  // A card that changes column is drawn anew and its handle loses the focus; a keyboard user keeps it,
  // also when a refused move puts the card back a moment after the drop.
  const activeId = dragging?.activeId;
  const lastDrop = useRef<{ id: string; at: number } | null>(null);
  useEffect(() => {
    const recent = lastDrop.current && Date.now() - lastDrop.current.at < 10_000 ? lastDrop.current.id : null;
    const id = activeId ?? recent;
    if (id) focusHandleIfLost(id);
  }, [activeId, columns]);

  // Over a column with cards, aim at the nearest card; over an empty one, at the column itself.
  // Remembering the last target stops the card flickering between two columns while it changes container.
  const collisionDetection: CollisionDetection = useCallback(
    (args) => {
      const pointer = pointerWithin(args);
      const hits = pointer.length > 0 ? pointer : rectIntersection(args);
      let overId = getFirstCollision(hits, 'id');
      if (overId != null) {
        const state = stateOfColumn(overId);
        if (state && columns[state].length > 0) {
          const inside = args.droppableContainers.filter((c) => columns[state].includes(String(c.id)));
          overId = closestCenter({ ...args, droppableContainers: inside })[0]?.id ?? overId;
        }
        lastOverId.current = overId;
        return [{ id: overId }];
      }
      if (movedToNewColumn.current && dragging) lastOverId.current = dragging.activeId;
      return lastOverId.current != null ? [{ id: lastOverId.current }] : [];
    },
    [columns, dragging],
  );

  const description = (id: UniqueIdentifier) => byId.get(String(id))?.description ?? 'The shot';
  const where = (id: UniqueIdentifier) => {
    const state = containerOf(columns, id);
    if (!state) return 'outside the board';
    const col = columns[state];
    const at = stateOfColumn(id) ? col.length : col.indexOf(String(id)) + 1;
    return `${shotStateLabels[state]}, position ${Math.max(at, 1)} of ${Math.max(col.length, 1)}`;
  };
  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up ${description(active.id)} in ${where(active.id)}.`,
    onDragOver: ({ active, over }) => {
      if (!over) return `${description(active.id)} is not over a column.`;
      const state = containerOf(columns, over.id);
      if (state && waitsForReview(byId.get(String(active.id)), state)) return `${description(active.id)} cannot go to Captured. ${REVIEW_REFUSAL}`;
      return `${description(active.id)} is over ${where(over.id)}.`;
    },
    onDragEnd: ({ active, over }) => {
      if (!over) return `${description(active.id)} dropped outside the board; it stays where it was.`;
      const state = containerOf(columns, over.id);
      if (state && waitsForReview(byId.get(String(active.id)), state)) return `${description(active.id)} stays where it was. ${REVIEW_REFUSAL}`;
      return `${description(active.id)} dropped in ${where(active.id)}.`;
    },
    onDragCancel: ({ active }) => `Moving ${description(active.id)} was cancelled; it stays where it was.`,
  };

  function onDragStart({ active }: DragStartEvent) {
    lastOverId.current = null;
    setDragging({ activeId: String(active.id), columns: settled });
  }

  function onDragOver({ active, over }: DragOverEvent) {
    if (!dragging || !over) return;
    const from = containerOf(dragging.columns, active.id);
    const to = containerOf(dragging.columns, over.id);
    if (!from || !to || from === to) return;
    if (waitsForReview(byId.get(String(active.id)), to)) return;
    const target = dragging.columns[to];
    const overIndex = target.indexOf(String(over.id));
    const translated = active.rect.current.translated;
    const below = translated !== null && overIndex >= 0 && translated.top > over.rect.top + over.rect.height / 2;
    const index = overIndex >= 0 ? overIndex + (below ? 1 : 0) : target.length;
    movedToNewColumn.current = true;
    setDragging({
      activeId: dragging.activeId,
      columns: {
        ...dragging.columns,
        [from]: dragging.columns[from].filter((id) => id !== active.id),
        [to]: [...target.slice(0, index), String(active.id), ...target.slice(index)],
      },
    });
  }

  function onDragEnd({ active, over }: DragEndEvent) {
    const current = dragging;
    const shot = byId.get(String(active.id));
    if (!current || !shot || !over) {
      setDragging(null);
      return;
    }
    const state = containerOf(current.columns, active.id);
    if (!state || waitsForReview(shot, state)) {
      setDragging(null);
      return;
    }
    let column = current.columns[state];
    const overIndex = column.indexOf(String(over.id));
    const activeIndex = column.indexOf(shot.id);
    if (overIndex >= 0 && overIndex !== activeIndex) column = arrayMove(column, activeIndex, overIndex);
    const final = { ...current.columns, [state]: column };
    const index = column.indexOf(shot.id);
    const afterId = index > 0 ? (column[index - 1] ?? null) : null;
    const unchanged = state === shot.state && settled[state].indexOf(shot.id) === index;
    setDragging(null);
    lastDrop.current = { id: shot.id, at: Date.now() };
    if (unchanged) return;
    if (state === 'retake' && shot.state !== 'retake') {
      setHeld({ columns: final, shots, untilClosed: true });
      void askRetake(shot, afterId).finally(() => {
        setHeld(null);
        requestAnimationFrame(() => focusHandleIfLost(shot.id));
      });
      return;
    }
    // A retake card moving inside its column keeps its reason; the server asks for one with every Retake.
    setHeld({ columns: final, shots, untilClosed: false });
    onMove({ shot, state, afterId, ...(state === 'retake' && { reason: shot.retakeReason ?? '' }) });
    requestAnimationFrame(() => focusHandleIfLost(shot.id));
  }

  const active = dragging ? byId.get(dragging.activeId) : undefined;
  const activeColumn = dragging ? containerOf(dragging.columns, dragging.activeId) : undefined;

  if (!canMove) {
    return (
      <div className="hidden gap-4 md:grid md:grid-cols-3">
        {shotStates.map((state) => (
          <StaticColumn key={state} state={state} count={settled[state].length}>
            {settled[state].map((id) => {
              const shot = byId.get(id);
              return shot ? <StaticShotCard key={id} slug={slug} shot={shot} /> : null;
            })}
          </StaticColumn>
        ))}
      </div>
    );
  }

  return (
    <DndContext
      id={dndId}
      sensors={sensors}
      collisionDetection={collisionDetection}
      accessibility={{ announcements, screenReaderInstructions }}
      onDragStart={onDragStart}
      onDragOver={onDragOver}
      onDragEnd={onDragEnd}
      onDragCancel={() => setDragging(null)}
    >
      <div className="hidden gap-4 md:grid md:grid-cols-3">
        {shotStates.map((state) => (
          <DroppableColumn
            key={state}
            state={state}
            ids={columns[state]}
            holdsActive={activeColumn === state}
            refusal={waitsForReview(active, state) ? REVIEW_REFUSAL : null}
          >
            {columns[state].map((id) => {
              const shot = byId.get(id);
              return shot ? <SortableShotCard key={id} slug={slug} shot={shot} /> : null;
            })}
          </DroppableColumn>
        ))}
      </div>
      <DragOverlay>{active ? <ShotCardPreview slug={slug} shot={active} /> : null}</DragOverlay>
    </DndContext>
  );
}
