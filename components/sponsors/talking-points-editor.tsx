'use client';

import { EditorContent, useEditor } from '@tiptap/react';
import { useState } from 'react';
import { scriptProseClasses } from '@/components/script/script-prose';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api/client';
import { scriptExtensions } from '@/lib/scripts/extensions';
import { plainTextOf } from '@/lib/scripts/plain-text';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import { useSponsorMutations } from './use-sponsor-mutations';

/** Talking points in the same Tiptap setup as scripts (scriptExtensions), saved on demand. */
export function TalkingPointsEditor({ channelSlug, deliverableId, initialDoc }: { channelSlug: string; deliverableId: string; initialDoc: ScriptDoc | null }) {
  const m = useSponsorMutations(channelSlug);
  const [status, setStatus] = useState<string | null>(null);
  const editor = useEditor({
    immediatelyRender: false,
    extensions: scriptExtensions,
    content: initialDoc ?? { type: 'doc', content: [{ type: 'paragraph' }] },
    editorProps: { attributes: { class: `${scriptProseClasses} min-h-24 rounded-md border border-ink/30 bg-white px-4 py-3 focus:outline-3 focus:outline-blueprint`, 'aria-label': 'Talking points', role: 'textbox', 'aria-multiline': 'true' } },
  });
  function save() {
    if (!editor) return;
    const doc = editor.getJSON();
    setStatus(null);
    m.updateDeliverable.mutate(
      { deliverableId, body: { talkingPoints: plainTextOf(doc).trim() === '' ? null : doc } },
      {
        onSuccess: () => setStatus('Talking points saved.'),
        onError: (err) => setStatus(err instanceof ApiError ? (err.fields.talkingPoints ?? err.message) : 'Could not save.'),
      },
    );
  }
  return (
    <div>
      <p className="mb-1 text-sm font-bold">Talking points</p>
      <EditorContent editor={editor} />
      <div className="mt-2 flex items-center gap-3">
        <Button variant="secondary" onClick={save} disabled={m.updateDeliverable.isPending}>
          Save talking points
        </Button>
        {status ? (
          <span role="status" className="text-sm text-ink-soft">
            {status}
          </span>
        ) : null}
      </div>
    </div>
  );
}
