'use client';

import { useDroppable } from '@dnd-kit/core';
import { SortableContext, verticalListSortingStrategy } from '@dnd-kit/sortable';
import type { ReactNode } from 'react';
import { shotStateLabels, type ShotState } from '@/lib/shots/catalog';

export const columnId = (state: ShotState) => `column:${state}`;

const accents: Record<ShotState, string> = {
  planned: 'border-t-ink/40',
  captured: 'border-t-ok',
  retake: 'border-t-attention',
};

type FrameProps = { state: ShotState; count: number; children: ReactNode; over?: boolean; movable?: boolean; refusal?: string | null };

function ColumnFrame({ state, count, children, over = false, movable = false, refusal = null, frameRef }: FrameProps & { frameRef?: (el: HTMLElement | null) => void }) {
  const label = shotStateLabels[state];
  return (
    <section
      ref={frameRef}
      aria-label={label}
      className={`flex min-w-0 flex-col gap-3 rounded-card border border-t-4 border-paper-edge p-3 transition-colors ${accents[state]} ${
        refusal ? 'bg-paper-deep' : over ? 'bg-blueprint-soft/70' : 'bg-paper-deep/50'
      }`}
    >
      <h2 className={`flex items-baseline justify-between gap-2 text-base font-bold ${state === 'retake' ? 'text-attention-ink' : ''}`}>
        {label}
        <span className="rounded-full bg-white/80 px-2 font-mono text-sm tabular-nums text-ink-soft">
          {count}
          <span className="sr-only"> {count === 1 ? 'shot' : 'shots'}</span>
        </span>
      </h2>
      {refusal ? (
        <p role="note" data-testid="column-refusal" className="rounded-md border-2 border-dashed border-attention/60 bg-white px-3 py-2 text-sm text-attention-ink">
          {refusal}
        </p>
      ) : null}
      {children}
      {count === 0 ? (
        <p className="rounded-md border-2 border-dashed border-paper-edge px-3 py-6 text-center text-sm text-ink-faint">
          {movable ? `No shots. Drop a card here to mark it ${label}.` : `No shots in ${label}.`}
        </p>
      ) : null}
    </section>
  );
}

/** A column that takes drops even when empty: the whole column is the drop target, not only its cards. */
export function DroppableColumn({
  state,
  ids,
  holdsActive,
  refusal,
  children,
}: {
  state: ShotState;
  ids: string[];
  holdsActive: boolean;
  /** Why the card being dragged may not be dropped here, shown on the column while it is dragged. */
  refusal: string | null;
  children: ReactNode;
}) {
  const { setNodeRef, isOver } = useDroppable({ id: columnId(state) });
  return (
    <ColumnFrame state={state} count={ids.length} over={!refusal && (isOver || holdsActive)} refusal={refusal} movable frameRef={setNodeRef}>
      <SortableContext id={state} items={ids} strategy={verticalListSortingStrategy}>
        <ol className="space-y-2.5">{children}</ol>
      </SortableContext>
    </ColumnFrame>
  );
}

export function StaticColumn({ state, count, children }: { state: ShotState; count: number; children: ReactNode }) {
  return (
    <ColumnFrame state={state} count={count}>
      <ol className="space-y-2.5">{children}</ol>
    </ColumnFrame>
  );
}
