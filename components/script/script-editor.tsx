'use client';

import { Placeholder } from '@tiptap/extension-placeholder';
import { EditorContent, useEditor, type JSONContent } from '@tiptap/react';
import { useEffect, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';
import { channelApi } from '@/lib/api/paths';
import { statusLabel } from '@/lib/scripts/autosave';
import { scriptExtensions } from '@/lib/scripts/extensions';
import { scriptStats } from '@/lib/scripts/plain-text';
import { emptyScriptDoc, type ScriptDoc, type ScriptDto } from '@/lib/scripts/schemas';
import { scriptProseClasses } from './script-prose';
import { ScriptToolbar } from './script-toolbar';
import { useScriptAutosave } from './use-script-autosave';

type Props = {
  channelSlug: string;
  segmentId: string;
  initialDoc: ScriptDoc | null;
  initialVersion: number;
  /** After each accepted save, and after "Reload their version" (the server's script at that point). */
  onSaved?: (s: { version: number; wordCount: number }) => void;
  onWordCount?: (n: number) => void;
};

const editorExtensions = [...scriptExtensions, Placeholder.configure({ placeholder: 'Write what you will say on camera…' })];

// The placeholder is a ::before on the empty first paragraph (Placeholder's `is-editor-empty` class
// and `data-placeholder` attribute); there is no global CSS for it, so it is styled here.
const placeholderClasses = [
  '[&_.is-editor-empty:first-child]:before:pointer-events-none',
  '[&_.is-editor-empty:first-child]:before:float-left',
  '[&_.is-editor-empty:first-child]:before:h-0',
  '[&_.is-editor-empty:first-child]:before:text-ink-faint',
  '[&_.is-editor-empty:first-child]:before:content-[attr(data-placeholder)]',
].join(' ');

const editableClasses = `${scriptProseClasses} ${placeholderClasses} min-h-72 rounded-b-card bg-white px-5 py-4 focus:outline-3 focus:-outline-offset-3 focus:outline-blueprint`;

function formatWords(n: number): string {
  return `${n.toLocaleString('en')} ${n === 1 ? 'word' : 'words'}`;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : 'Something went wrong. Try again.';
}

/** The script of one segment, autosaved. Key it by segment id: it reads its props only once. */
export function ScriptEditor({ channelSlug, segmentId, initialDoc, initialVersion, onSaved, onWordCount }: Props) {
  const url = channelApi(channelSlug, 'segments', segmentId, 'script');
  const urlRef = useRef(url);
  // The newest text, kept outside the editor so a save can still read it after the editor is gone.
  const docRef = useRef<JSONContent>(initialDoc ?? emptyScriptDoc);
  const callbacks = useRef({ onSaved, onWordCount });
  useEffect(() => {
    urlRef.current = url;
    callbacks.current = { onSaved, onWordCount };
  });

  const [wordCount, setWordCount] = useState(() => scriptStats(initialDoc ?? emptyScriptDoc).wordCount);
  const wordCountRef = useRef(wordCount);
  const [resolving, setResolving] = useState<'reload' | 'overwrite' | null>(null);
  const [resolveError, setResolveError] = useState<string | null>(null);

  const { autosaver, snapshot } = useScriptAutosave({
    urlRef,
    docRef,
    initialVersion,
    onSaved: (outcome) => callbacks.current.onSaved?.(outcome),
  });

  const editor = useEditor({
    immediatelyRender: false,
    extensions: editorExtensions,
    content: initialDoc ?? emptyScriptDoc,
    editorProps: {
      attributes: { 'aria-label': 'Script', role: 'textbox', 'aria-multiline': 'true', class: editableClasses },
    },
  });

  function countWords(doc: JSONContent) {
    const n = scriptStats(doc).wordCount;
    if (n === wordCountRef.current) return;
    wordCountRef.current = n;
    setWordCount(n);
    callbacks.current.onWordCount?.(n);
  }
  const countWordsRef = useRef(countWords);
  useEffect(() => {
    countWordsRef.current = countWords;
  });

  useEffect(() => {
    if (!editor) return;
    const onUpdate = () => {
      docRef.current = editor.getJSON();
      countWordsRef.current(docRef.current);
      autosaver.edit();
    };
    editor.on('update', onUpdate);
    return () => {
      editor.off('update', onUpdate);
    };
  }, [editor, autosaver]);

  async function reloadTheirs() {
    if (!editor) return;
    setResolving('reload');
    setResolveError(null);
    // Typing during the fetch would be replaced unseen; the editor's own undo still holds our text.
    editor.setEditable(false, false);
    try {
      const { script } = await apiFetch<{ script: ScriptDto }>(urlRef.current);
      editor.commands.setContent(script.doc ?? emptyScriptDoc, { emitUpdate: false });
      docRef.current = editor.getJSON();
      countWords(docRef.current);
      autosaver.reloaded(script.version);
      callbacks.current.onSaved?.({ version: script.version, wordCount: script.wordCount });
      editor.setEditable(true, false);
      // The button that had focus goes away with the alert.
      editor.commands.focus();
    } catch (error) {
      setResolveError(messageOf(error));
    } finally {
      editor.setEditable(true, false);
      setResolving(null);
    }
  }

  async function overwriteWithMine() {
    setResolving('overwrite');
    setResolveError(null);
    try {
      const { script } = await apiFetch<{ script: ScriptDto }>(urlRef.current);
      autosaver.overwrite(script.version);
      editor?.commands.focus();
    } catch (error) {
      setResolveError(messageOf(error));
    } finally {
      setResolving(null);
    }
  }

  const status = snapshot.status;
  const failing = status.kind === 'retrying' || status.kind === 'rejected' || status.kind === 'conflict';

  return (
    <div className="space-y-3">
      {status.kind === 'conflict' ? (
        <Alert tone="attention">
          <p className="font-bold">Someone else changed this script since you opened it.</p>
          <p className="mt-1">
            Your text is still here and is not saved. Reloading replaces it with theirs (Undo brings yours back); overwriting replaces
            theirs with yours.
          </p>
          {resolveError ? <p className="mt-1">{resolveError}</p> : null}
          <div className="mt-3 flex flex-wrap gap-2">
            <Button variant="secondary" disabled={resolving !== null || !editor} onClick={() => void reloadTheirs()}>
              {resolving === 'reload' ? 'Reloading…' : 'Reload their version'}
            </Button>
            <Button variant="danger" disabled={resolving !== null} onClick={() => void overwriteWithMine()}>
              {resolving === 'overwrite' ? 'Overwriting…' : 'Overwrite with mine'}
            </Button>
          </div>
        </Alert>
      ) : null}

      <div className="rounded-card border border-ink/30 bg-white shadow-card">
        <ScriptToolbar editor={editor} />
        {editor ? (
          <EditorContent editor={editor} />
        ) : (
          // Holds the editor's place until it mounts in the browser (immediatelyRender: false).
          <div className="min-h-72 rounded-b-card bg-white" aria-hidden="true" />
        )}
      </div>

      <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
        <p className="tabular-nums text-ink-soft">{formatWords(wordCount)}</p>
        <p role="status" aria-live="polite" className={failing ? 'font-bold text-attention-ink' : 'text-ink-soft'}>
          {statusLabel(status)}
        </p>
      </div>
    </div>
  );
}
