'use client';

import { Placeholder } from '@tiptap/extension-placeholder';
import { EditorContent, useEditor, useEditorState, type Editor, type JSONContent } from '@tiptap/react';
import { useEffect, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/api/client';
import { createAutosaver, statusLabel, type AutosaveSnapshot, type SaveOutcome } from '@/lib/scripts/autosave';
import { scriptExtensions } from '@/lib/scripts/extensions';
import { scriptStats } from '@/lib/scripts/plain-text';
import { emptyScriptDoc, type SavedScriptDto, type ScriptDoc, type ScriptDto } from '@/lib/scripts/schemas';
import { scriptProseClasses } from './script-prose';

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

const toolClasses =
  'inline-flex min-h-touch min-w-touch items-center justify-center rounded-md px-2 text-sm text-ink hover:bg-paper-deep aria-pressed:bg-ink aria-pressed:text-paper aria-disabled:cursor-not-allowed aria-disabled:text-ink-faint aria-disabled:hover:bg-transparent';

type ToolState = {
  bold: boolean;
  italic: boolean;
  heading: boolean;
  bulletList: boolean;
  orderedList: boolean;
  blockquote: boolean;
  canUndo: boolean;
  canRedo: boolean;
};

type Tool = {
  label: string;
  glyph: ReactNode;
  run: (editor: Editor) => void;
  pressed?: (s: ToolState) => boolean;
  enabled?: (s: ToolState) => boolean;
};

const tools: Tool[] = [
  { label: 'Bold', glyph: <b>B</b>, run: (e) => e.chain().focus().toggleBold().run(), pressed: (s) => s.bold },
  { label: 'Italic', glyph: <i className="font-serif">I</i>, run: (e) => e.chain().focus().toggleItalic().run(), pressed: (s) => s.italic },
  {
    label: 'Heading 2',
    glyph: <b>H2</b>,
    run: (e) => e.chain().focus().toggleHeading({ level: 2 }).run(),
    pressed: (s) => s.heading,
  },
  { label: 'Bullet list', glyph: <span className="text-lg">•≡</span>, run: (e) => e.chain().focus().toggleBulletList().run(), pressed: (s) => s.bulletList },
  { label: 'Ordered list', glyph: <span>1.≡</span>, run: (e) => e.chain().focus().toggleOrderedList().run(), pressed: (s) => s.orderedList },
  { label: 'Blockquote', glyph: <span className="text-xl font-bold leading-none">“</span>, run: (e) => e.chain().focus().toggleBlockquote().run(), pressed: (s) => s.blockquote },
  { label: 'Undo', glyph: <span className="text-lg">↶</span>, run: (e) => e.chain().focus().undo().run(), enabled: (s) => s.canUndo },
  { label: 'Redo', glyph: <span className="text-lg">↷</span>, run: (e) => e.chain().focus().redo().run(), enabled: (s) => s.canRedo },
];

function formatWords(n: number): string {
  return `${n.toLocaleString('en')} ${n === 1 ? 'word' : 'words'}`;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : 'Something went wrong. Try again.';
}

/** The script of one segment, autosaved. Key it by segment id: it reads its props only once. */
export function ScriptEditor({ channelSlug, segmentId, initialDoc, initialVersion, onSaved, onWordCount }: Props) {
  const url = `/api/channels/${encodeURIComponent(channelSlug)}/segments/${encodeURIComponent(segmentId)}/script`;
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
  const [snapshot, setSnapshot] = useState<AutosaveSnapshot>({ status: { kind: 'saved' }, unsaved: false });
  const [resolving, setResolving] = useState<'reload' | 'overwrite' | null>(null);
  const [resolveError, setResolveError] = useState<string | null>(null);

  // One autosaver for the component's life; it outlives a StrictMode effect re-run and an unmount
  // (a save or retry in flight then still finishes, reading docRef).
  const [autosaver] = useState(() =>
    createAutosaver({
      baseVersion: initialVersion,
      save: async (baseVersion): Promise<SaveOutcome> => {
        const { script } = await apiFetch<{ script: SavedScriptDto }>(urlRef.current, {
          method: 'PUT',
          body: { doc: docRef.current, baseVersion },
        });
        return { version: script.version, wordCount: script.wordCount };
      },
      onChange: setSnapshot,
      onSaved: (outcome) => callbacks.current.onSaved?.(outcome),
    }),
  );

  const editor = useEditor({
    immediatelyRender: false,
    extensions: editorExtensions,
    content: initialDoc ?? emptyScriptDoc,
    editorProps: {
      attributes: { 'aria-label': 'Script', role: 'textbox', 'aria-multiline': 'true', class: editableClasses },
    },
  });

  const toolState = useEditorState({
    editor,
    selector: ({ editor: e }): ToolState | null =>
      e
        ? {
            bold: e.isActive('bold'),
            italic: e.isActive('italic'),
            heading: e.isActive('heading', { level: 2 }),
            bulletList: e.isActive('bulletList'),
            orderedList: e.isActive('orderedList'),
            blockquote: e.isActive('blockquote'),
            canUndo: e.can().undo(),
            canRedo: e.can().redo(),
          }
        : null,
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

  // Save at once when the connection returns, when the tab is hidden (it may be closed next) and on
  // unmount (navigating inside the app fires no beforeunload).
  useEffect(() => {
    const flush = () => autosaver.flush();
    const onHidden = () => {
      if (document.visibilityState === 'hidden') autosaver.flush();
    };
    window.addEventListener('online', flush);
    document.addEventListener('visibilitychange', onHidden);
    return () => {
      window.removeEventListener('online', flush);
      document.removeEventListener('visibilitychange', onHidden);
      autosaver.flush();
    };
  }, [autosaver]);

  // Only while something is unsaved: a beforeunload listener keeps the page out of the back/forward cache.
  useEffect(() => {
    if (!snapshot.unsaved) return;
    const warn = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Source: MDN, beforeunload: older browsers show the prompt only when returnValue is set.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [snapshot.unsaved]);

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

  // Roving tabindex (WAI-ARIA toolbar pattern): one Tab stop, arrow keys move between the tools.
  const [activeTool, setActiveTool] = useState(0);
  const toolRefs = useRef<Array<HTMLButtonElement | null>>([]);
  function onToolbarKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    const last = tools.length - 1;
    const next =
      event.key === 'ArrowRight' ? (activeTool === last ? 0 : activeTool + 1)
      : event.key === 'ArrowLeft' ? (activeTool === 0 ? last : activeTool - 1)
      : event.key === 'Home' ? 0
      : event.key === 'End' ? last
      : null;
    if (next === null) return;
    event.preventDefault();
    setActiveTool(next);
    toolRefs.current[next]?.focus();
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
        <div
          role="toolbar"
          aria-label="Formatting"
          onKeyDown={onToolbarKeyDown}
          className="flex flex-wrap gap-1 rounded-t-card border-b border-paper-edge bg-paper-deep/60 p-1"
        >
          {tools.map((tool, i) => {
            const enabled = toolState !== null && (tool.enabled?.(toolState) ?? true);
            return (
              <button
                key={tool.label}
                ref={(el) => {
                  toolRefs.current[i] = el;
                }}
                type="button"
                title={tool.label}
                aria-label={tool.label}
                aria-pressed={tool.pressed ? (toolState ? tool.pressed(toolState) : false) : undefined}
                aria-disabled={enabled ? undefined : true}
                tabIndex={i === activeTool ? 0 : -1}
                onFocus={() => setActiveTool(i)}
                onClick={() => {
                  if (editor && enabled) tool.run(editor);
                }}
                className={toolClasses}
              >
                <span aria-hidden="true">{tool.glyph}</span>
              </button>
            );
          })}
        </div>
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
