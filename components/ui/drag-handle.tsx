'use client';

import type { DraggableAttributes, DraggableSyntheticListeners } from '@dnd-kit/core';
import { GripIcon } from './grip-icon';

type Sortable = {
  attributes: DraggableAttributes;
  listeners: DraggableSyntheticListeners;
  setActivatorNodeRef: (element: HTMLElement | null) => void;
};

const layouts = {
  /** A full-height strip down the left edge of a card. */
  strip: 'flex shrink-0 touch-none items-center justify-center self-stretch border-r border-paper-edge',
  /** A square button in a table row. */
  button: 'flex min-h-touch min-w-touch touch-none items-center justify-center rounded-md',
} as const;

/**
 * The grip a sortable card or row is dragged by (and picked up with Space from the keyboard).
 * `sortable` is what dnd-kit's useSortable returned for the item; `label` names the item for screen readers.
 */
export function DragHandle({
  sortable,
  label,
  layout,
  className = '',
  small = false,
  ...data
}: {
  sortable: Sortable;
  label: string;
  layout: keyof typeof layouts;
  className?: string;
  small?: boolean;
} & Record<`data-${string}`, string>) {
  return (
    <button
      type="button"
      ref={sortable.setActivatorNodeRef}
      {...sortable.attributes}
      {...sortable.listeners}
      {...data}
      aria-label={label}
      className={`${layouts[layout]} cursor-grab text-ink-faint hover:bg-paper-deep hover:text-ink active:cursor-grabbing ${className}`}
    >
      <GripIcon small={small} />
    </button>
  );
}

/** The same grip drawn on a drag overlay's copy of the card: not a control, so not focusable. */
export function DragHandlePreview({ className = '' }: { className?: string }) {
  return (
    <span aria-hidden="true" className={`${layouts.strip} cursor-grabbing text-ink ${className}`}>
      <GripIcon />
    </span>
  );
}
