'use client';

import {
  closestCenter,
  DndContext,
  type Announcements,
  type DragEndEvent,
  type Modifier,
  type ScreenReaderInstructions,
  type UniqueIdentifier,
} from '@dnd-kit/core';
import { SortableContext, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { can } from '@/lib/auth/policy';
import { useSortableList } from '@/components/ui/use-sortable-list';
import { mayEditShot } from '@/lib/shots/policy';
import type { ShotDto } from '@/lib/shots/schemas';
import { emptyQuickAdd, ShotQuickAdd, type QuickAddDraft } from './shot-quick-add';
import { type CrewOption } from './shot-editor';
import { ShotRow } from './shot-row';
import { useDeleteShot, useDuplicateShot, useMoveShot, useRestoreShot, useSegmentShots } from './use-shots';
import { useViewer } from '@/components/providers/viewer-provider';

type Props = {
  channelSlug: string;
  segmentId: string;
  initialShots: ShotDto[];
  crew: CrewOption[];
};

type Notice = { kind: 'deleted'; shotId: string; number: number } | { kind: 'done'; text: string } | { kind: 'failed'; text: string };

// A shot list is one column: sideways movement only makes the row wander.
const verticalOnly: Modifier = ({ transform }) => ({ ...transform, x: 0 });

const screenReaderInstructions: ScreenReaderInstructions = {
  draggable:
    'To move a shot, press Space or Enter on its move handle, use the Up and Down arrow keys to choose a new place, then press Space or Enter to drop it, or Escape to cancel. On a touch screen, press and hold the handle, then drag.',
};

const headers = ['#', 'Framing', 'Camera', 'Description', 'Assignee', 'Due', 'Notes', 'State'];

export function ShotList({ channelSlug, segmentId, initialShots, crew }: Props) {
  const viewer = useViewer();
  const shots = useSegmentShots(channelSlug, segmentId, initialShots);
  const list = shots.data;
  const move = useMoveShot(channelSlug, segmentId);
  const remove = useDeleteShot(channelSlug, segmentId);
  const restore = useRestoreShot(channelSlug);
  const duplicate = useDuplicateShot(channelSlug);
  const [editingId, setEditing] = useState<string | null>(null);
  const [notice, setNotice] = useState<Notice | null>(null);
  const [draft, setDraft] = useState<QuickAddDraft>(emptyQuickAdd);
  const headingRef = useRef<HTMLHeadingElement>(null);
  const returnFocusTo = useRef<string | null>(null);

  // A row deleted elsewhere while open simply closes its editor.
  const editingShot = editingId ? list.find((s) => s.id === editingId) : undefined;
  const editing = editingShot ? editingShot.id : null;
  const canManage = can(viewer.role, 'shots.edit');
  const mayEditAny = canManage || list.some((s) => mayEditShot(viewer, s));
  const columns = mayEditAny ? 9 : 8;

  const ids = useMemo(() => list.map((s) => s.id), [list]);
  const { dndId, sensors, dropOf, noteStart, overChanged } = useSortableList(ids);
  const count = ids.length;
  const numberOf = (id: UniqueIdentifier) => ids.indexOf(String(id)) + 1;
  const at = (id: UniqueIdentifier) => `place ${numberOf(id)} of ${count}`;

  const announcements: Announcements = {
    onDragStart: ({ active }) => {
      noteStart(active.id);
      return `Picked up shot ${numberOf(active.id)}.`;
    },
    onDragOver: ({ active, over }) => {
      if (!overChanged(over?.id ?? null)) return undefined;
      return over ? `Shot ${numberOf(active.id)} moved to ${at(over.id)}.` : `Shot ${numberOf(active.id)} is no longer over the list.`;
    },
    onDragEnd: ({ active, over }) =>
      over ? `Shot dropped at ${at(over.id)}.` : `Shot ${numberOf(active.id)} dropped outside the list. It stays at ${at(active.id)}.`,
    onDragCancel: ({ active }) => `Moving shot ${numberOf(active.id)} was cancelled. It stays at ${at(active.id)}.`,
  };

  // After the editor closes, focus goes back to the row's Edit button, which mounts again in this commit.
  useEffect(() => {
    if (editing !== null || !returnFocusTo.current) return;
    document.querySelector<HTMLElement>(`#shot-${returnFocusTo.current} [data-shot-edit]`)?.focus();
    returnFocusTo.current = null;
  }, [editing]);

  function onDragEnd(event: DragEndEvent) {
    const drop = dropOf(event);
    if (drop) move.mutate({ shotId: drop.id, afterId: drop.afterId, number: drop.from + 1 });
  }

  function onDelete(shot: ShotDto) {
    setNotice({ kind: 'deleted', shotId: shot.id, number: shot.number });
    remove.mutate(
      { shotId: shot.id, number: shot.number },
      { onError: (err) => setNotice({ kind: 'failed', text: `Could not delete shot ${shot.number}: ${err.message}` }) },
    );
    // The row that held focus is gone; the heading is the nearest stable place, and Undo is the next stop.
    headingRef.current?.focus();
  }

  function onUndo(shotId: string) {
    restore.mutate(shotId, {
      onSuccess: (shot) => setNotice({ kind: 'done', text: `Shot ${shot.number} restored.` }),
      onError: (err) => setNotice({ kind: 'failed', text: `Could not restore the shot: ${err.message}` }),
    });
  }

  function onDuplicate(shot: ShotDto) {
    duplicate.mutate(shot.id, {
      onSuccess: (copy) => setNotice({ kind: 'done', text: `Shot ${shot.number} duplicated as shot ${copy.number}.` }),
      onError: (err) => setNotice({ kind: 'failed', text: `Could not duplicate shot ${shot.number}: ${err.message}` }),
    });
  }


  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="shots-heading" ref={headingRef} tabIndex={-1} className="text-lg font-bold">
          Shots
        </h2>
        <p className="text-sm text-ink-soft">
          {count} {count === 1 ? 'shot' : 'shots'}
          {shots.isFetching ? <span className="ml-2 text-ink-faint">Refreshing…</span> : null}
        </p>
      </div>

      {!mayEditAny ? (
        <p className="rounded-md border border-paper-edge bg-paper-deep/60 px-3 py-2 text-sm text-ink-soft">
          Read-only: {viewer.role === 'editor' ? 'an Editor reads the shot list.' : 'a Shop hand edits only the shots assigned to them.'}
        </p>
      ) : null}

      {shots.isError ? (
        <Alert tone="attention">
          <span className="flex flex-wrap items-center justify-between gap-2">
            <span>Could not refresh the shot list: {shots.error.message}</span>
            <Button variant="quiet" className="-my-2" onClick={() => void shots.refetch()}>
              Try again
            </Button>
          </span>
        </Alert>
      ) : null}
      {move.isError ? (
        <Alert tone="attention">
          <span className="flex flex-wrap items-center justify-between gap-2">
            <span>
              Could not move shot {move.variables?.number ?? ''}: {move.error.message} It is back in its place.
            </span>
            <Button variant="quiet" className="-my-2" onClick={() => move.reset()}>
              Dismiss
            </Button>
          </span>
        </Alert>
      ) : null}
      {notice?.kind === 'failed' ? <Alert tone="attention">{notice.text}</Alert> : null}

      <div role="status" className={notice && notice.kind !== 'failed' ? 'flex min-h-touch flex-wrap items-center gap-3 rounded-md border-l-4 border-ok bg-ok-soft px-4 py-1 text-sm text-ok' : 'sr-only'}>
        {notice?.kind === 'deleted' ? (
          <>
            <span>Shot {notice.number} deleted.</span>
            <Button variant="secondary" disabled={remove.isPending || restore.isPending} onClick={() => onUndo(notice.shotId)}>
              Undo
            </Button>
          </>
        ) : notice?.kind === 'done' ? (
          <span>{notice.text}</span>
        ) : null}
      </div>

      {count === 0 ? (
        <div className="rounded-card border-2 border-dashed border-paper-edge bg-white/40 px-6 py-8 text-center text-ink-soft">
          <p className="font-bold text-ink">No shots yet.</p>
          <p className="mt-1">{canManage ? 'Paste the shot list below, one shot per line.' : 'A Host has not planned the shots of this segment yet.'}</p>
        </div>
      ) : (
        <DndContext
          id={dndId}
          sensors={sensors}
          collisionDetection={closestCenter}
          modifiers={[verticalOnly]}
          accessibility={{ announcements, screenReaderInstructions }}
          onDragStart={() => setNotice(null)}
          onDragEnd={onDragEnd}
        >
          <SortableContext items={ids} strategy={verticalListSortingStrategy}>
            <table aria-label="Shot list" className="block w-full text-left text-sm sm:table">
              <thead className="hidden sm:table-header-group">
                <tr className="border-b border-paper-edge text-xs text-ink-faint">
                  {headers.map((h) => (
                    <th key={h} scope="col" className="py-1 pr-3 font-bold">
                      {h}
                    </th>
                  ))}
                  {columns === 9 ? (
                    <th scope="col" className="py-1 font-bold">
                      Actions
                    </th>
                  ) : null}
                </tr>
              </thead>
              <tbody className="block space-y-3 sm:table-row-group sm:space-y-0">
                {list.map((shot) => (
                  <ShotRow
                    key={shot.id}
                    channelSlug={channelSlug}
                    shot={shot}
                    crew={crew}
                    columns={columns}
                    canReorder={canManage && count > 1}
                    canEdit={mayEditShot(viewer, shot)}
                    canManage={canManage}
                    canAssign={canManage}
                    editing={editing === shot.id}
                    editLocked={editing !== null && editing !== shot.id}
                    busy={duplicate.isPending || (remove.isPending && remove.variables?.shotId === shot.id)}
                    onEdit={() => {
                      setNotice(null);
                      setEditing(shot.id);
                    }}
                    onClose={() => {
                      returnFocusTo.current = shot.id;
                      setEditing(null);
                    }}
                    onDuplicate={() => onDuplicate(shot)}
                    onDelete={() => onDelete(shot)}
                  />
                ))}
              </tbody>
            </table>
          </SortableContext>
        </DndContext>
      )}

      {canManage ? (
        editingShot ? (
          <p className="text-sm text-ink-faint">Quick add comes back when you save or cancel shot {editingShot.number}; anything pasted there is kept.</p>
        ) : (
          <ShotQuickAdd
            channelSlug={channelSlug}
            segmentId={segmentId}
            crew={crew}
            draft={draft}
            onDraft={setDraft}
            onAdded={(n) => setNotice({ kind: 'done', text: `Added ${n} ${n === 1 ? 'shot' : 'shots'}.` })}
          />
        )
      ) : null}
    </div>
  );
}
