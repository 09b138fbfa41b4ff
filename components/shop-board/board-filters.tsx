'use client';

import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { roleLabels, type Role } from '@/lib/auth/policy';
import { cameraLabels, cameras, type Camera } from '@/lib/shots/catalog';
import type { BoardFilters } from './board-query';

export type EpisodeOption = { id: string; title: string };
export type AssigneeOption = { userId: string; name: string; role: Role };

type Props = {
  filters: BoardFilters;
  onChange: (next: BoardFilters) => void;
  episodes: EpisodeOption[];
  assignees: AssigneeOption[];
  /** Segments of the chosen episode; undefined while they load. */
  segments: { id: string; title: string }[] | undefined;
};

const isCamera = (v: string): v is Camera => (cameras as readonly string[]).includes(v);

export function BoardFilterBar({ filters, onChange, episodes, assignees, segments }: Props) {
  const without = (key: keyof BoardFilters) => {
    const next = { ...filters };
    delete next[key];
    return next;
  };
  const set = (key: keyof BoardFilters, value: string) => (value ? { ...without(key), [key]: value } : without(key));
  const any = Object.keys(filters).length > 0;

  return (
    <div role="group" aria-label="Filter shots" className="grid grid-cols-2 items-end gap-3 lg:grid-cols-[repeat(4,minmax(0,1fr))_auto]">
      <SelectField
        label="Episode"
        className="col-span-2 sm:col-span-1"
        value={filters.episodeId ?? ''}
        onChange={(e) => {
          // A segment belongs to one episode, so changing episode clears it.
          const next = set('episodeId', e.target.value);
          delete next.segmentId;
          onChange(next);
        }}
      >
        <option value="">All episodes</option>
        {episodes.map((ep) => (
          <option key={ep.id} value={ep.id}>
            {ep.title}
          </option>
        ))}
      </SelectField>
      <SelectField label="Assignee" value={filters.assigneeId ?? ''} onChange={(e) => onChange(set('assigneeId', e.target.value))}>
        <option value="">Anyone</option>
        <option value="none">Unassigned</option>
        {assignees.map((m) => (
          <option key={m.userId} value={m.userId}>
            {m.name} ({roleLabels[m.role]})
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Camera"
        value={filters.camera ?? ''}
        onChange={(e) => onChange(isCamera(e.target.value) ? { ...filters, camera: e.target.value } : without('camera'))}
      >
        <option value="">Any camera</option>
        {cameras.map((c) => (
          <option key={c} value={c}>
            {cameraLabels[c]}
          </option>
        ))}
      </SelectField>
      {filters.episodeId ? (
        <SelectField label="Segment" className="col-span-2 sm:col-span-1" value={filters.segmentId ?? ''} onChange={(e) => onChange(set('segmentId', e.target.value))}>
          <option value="">{segments ? 'Any segment' : 'Loading segments…'}</option>
          {(segments ?? []).map((s) => (
            <option key={s.id} value={s.id}>
              {s.title}
            </option>
          ))}
        </SelectField>
      ) : (
        <p className="hidden text-sm text-ink-faint lg:block lg:pb-3">Choose an episode to filter by segment.</p>
      )}
      {any ? (
        <Button variant="quiet" onClick={() => onChange({})} className="col-span-2 justify-self-start sm:col-span-1">
          Clear filters
        </Button>
      ) : null}
    </div>
  );
}
