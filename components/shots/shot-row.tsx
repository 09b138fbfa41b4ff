'use client';

import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { Button } from '@/components/ui/button';
import { cameraLabels, framingLabels } from '@/lib/shots/catalog';
import type { ShotDto } from '@/lib/shots/schemas';
import { ShotEditor, type CrewOption } from './shot-editor';
import { DragHandle } from '@/components/ui/drag-handle';
import { DueBadge } from './due-badge';
import { ShotHistory } from './shot-history';
import { formatDay } from '@/components/shop-board/dates';
import { Badge } from '@/components/ui/badge';


type Props = {
  channelSlug: string;
  shot: ShotDto;
  crew: CrewOption[];
  columns: number;
  canReorder: boolean;
  canEdit: boolean;
  canManage: boolean;
  canAssign: boolean;
  editing: boolean;
  editLocked: boolean;
  onEdit: () => void;
  onClose: () => void;
  onDuplicate: () => void;
  onDelete: () => void;
  busy: boolean;
};


// Below sm each row is a card; the inline labels stand in for the hidden column headers there.
const cell = 'block sm:table-cell sm:border-b sm:border-paper-edge/70 sm:py-2 sm:pr-3 sm:align-top';
const smallLabel = 'text-xs font-bold text-ink-faint sm:hidden';
// On a phone the row actions read as buttons at a glance; in the desktop table they stay quiet.
const mobileBorder = 'max-sm:border max-sm:border-ink/20';

export function ShotRow(props: Props) {
  const { shot, canReorder, editing } = props;
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({
    id: shot.id,
    disabled: !canReorder || editing,
  });
  const style = { transform: CSS.Translate.toString(transform), transition };
  const dragClass = isDragging ? 'relative z-10 bg-white shadow-xl ring-2 ring-blueprint-line' : '';

  if (editing) {
    return (
      <tr ref={setNodeRef} id={`shot-${shot.id}`} style={style} className="block scroll-mt-4 sm:table-row">
        <td colSpan={props.columns} className="block rounded-card border border-ink/30 bg-paper-deep/60 p-4 sm:table-cell sm:rounded-none">
          <ShotEditor {...props} />
        </td>
      </tr>
    );
  }

  const handle = canReorder ? (
    <DragHandle sortable={{ attributes, listeners, setActivatorNodeRef }} label={`Move shot ${shot.number}`} layout="button" small />
  ) : null;

  return (
    <tr
      ref={setNodeRef}
      id={`shot-${shot.id}`}
      style={style}
      className={`flex scroll-mt-4 flex-wrap items-center gap-x-4 gap-y-1 rounded-card border border-paper-edge bg-white/80 p-3 target:ring-2 target:ring-blueprint-line sm:table-row sm:rounded-none sm:border-0 sm:bg-transparent sm:p-0 ${dragClass}`}
    >
      <td className={`${cell} sm:w-20`}>
        <span className="flex items-center gap-1">
          {handle}
          <span className="font-mono font-bold">
            <span className="sr-only">Shot </span>
            {shot.number}
          </span>
        </span>
      </td>
      <td className={`${cell} sm:whitespace-nowrap`}>
        <span className="sr-only sm:hidden">Framing: </span>
        {framingLabels[shot.framing]}
      </td>
      <td className={`${cell} sm:whitespace-nowrap`}>
        <span className="sr-only sm:hidden">Camera: </span>
        {cameraLabels[shot.camera]}
      </td>
      <td className={`${cell} basis-full font-bold sm:font-normal`}>
        <span className="sr-only sm:hidden">Description: </span>
        <span className="break-words">{shot.description}</span>
      </td>
      <td className={cell}>
        <span className={smallLabel}>Assignee </span>
        {shot.assigneeName ?? <span className="text-ink-faint">Unassigned</span>}
      </td>
      <td className={`${cell} sm:whitespace-nowrap`}>
        <span className={smallLabel}>Due </span>
        {shot.dueDate ? <time dateTime={shot.dueDate}>{formatDay(shot.dueDate)}</time> : <span className="text-ink-faint">No date</span>}{' '}
        <DueBadge dueDate={shot.dueDate} state={shot.state} />
      </td>
      <td className={`${cell} basis-full ${shot.notes ? '' : 'max-sm:hidden'}`}>
        <span className={smallLabel}>Notes </span>
        {shot.notes ? <span className="whitespace-pre-line break-words text-ink-soft">{shot.notes}</span> : <span className="text-ink-faint">—</span>}
      </td>
      <td className={cell}>
        <span className="sr-only sm:hidden">State: </span>
        <StateBadge shot={shot} />
        <ShotHistory channelSlug={props.channelSlug} shotId={shot.id} number={shot.number} />
      </td>
      {props.columns === 9 ? (
        <td className={`${cell} basis-full sm:whitespace-nowrap`}>
          <RowActions {...props} />
        </td>
      ) : null}
    </tr>
  );
}

function RowActions({ shot, canEdit, canManage, editLocked, onEdit, onDuplicate, onDelete, busy }: Props) {
  if (!canEdit && !canManage) return <span className="sr-only">No actions</span>;
  return (
    <span className="flex flex-wrap gap-2 sm:-my-2 sm:flex-nowrap sm:gap-0">
      {canEdit ? (
        <Button data-shot-edit variant="quiet" aria-label={`Edit shot ${shot.number}`} disabled={editLocked} onClick={onEdit} className={mobileBorder}>
          Edit
        </Button>
      ) : null}
      {canManage ? (
        <>
          <Button variant="quiet" aria-label={`Duplicate shot ${shot.number}`} disabled={busy} onClick={onDuplicate} className={mobileBorder}>
            Duplicate
          </Button>
          <Button variant="quiet" aria-label={`Delete shot ${shot.number}`} disabled={busy} onClick={onDelete} className={`${mobileBorder} text-attention-ink`}>
            Delete
          </Button>
        </>
      ) : null}
    </span>
  );
}

function StateBadge({ shot }: { shot: ShotDto }) {
  if (shot.state === 'captured') {
    return <Badge tone="okOutlined">Captured</Badge>;
  }
  if (shot.state === 'retake') {
    return (
      <span className="inline-flex flex-col gap-0.5">
        <Badge tone="attention" className="w-fit">
          Retake
        </Badge>
        {shot.retakeReason ? <span className="text-xs text-attention-ink">{shot.retakeReason}</span> : null}
      </span>
    );
  }
  return <Badge tone="neutral">Planned</Badge>;
}
