'use client';

import { useState } from 'react';
import { SelectField } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { editStageLabels, editStages, type EditStage } from '@/lib/edit/stages';
import { useSetEditStage } from './use-handoff';

/** Editor and Host move the edit along; the server keeps who and when. */
export function EditStageSelect({ slug, episodeId, initial, canEdit }: { slug: string; episodeId: string; initial: EditStage | null; canEdit: boolean }) {
  const [stage, setStage] = useState<EditStage | null>(initial);
  const mutation = useSetEditStage(slug, episodeId);
  if (!canEdit) return <p className="text-sm">Edit stage: <strong>{stage ? editStageLabels[stage] : 'Not started'}</strong></p>;
  return (
    <div className="print:hidden">
      <SelectField
        label="Edit stage"
        value={stage ?? ''}
        disabled={mutation.isPending}
        error={mutation.error instanceof ApiError ? mutation.error.message : undefined}
        onChange={(e) => {
          const next = e.target.value as EditStage;
          const before = stage;
          setStage(next);
          mutation.mutate(next, { onError: () => setStage(before) });
        }}
      >
        {stage === null ? <option value="">Not started</option> : null}
        {editStages.map((s) => (
          <option key={s} value={s}>
            {editStageLabels[s]}
          </option>
        ))}
      </SelectField>
      <p className="mt-1 min-h-5 text-sm text-ink-faint" role="status">
        {mutation.isSuccess ? `Saved: ${editStageLabels[mutation.data.editStage]}` : ''}
      </p>
    </div>
  );
}
