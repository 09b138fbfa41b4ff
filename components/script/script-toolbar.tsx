'use client';

import { useEditorState, type Editor } from '@tiptap/react';
import { useRef, useState, type KeyboardEvent, type ReactNode } from 'react';

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

/** The script editor's formatting buttons; `editor` is null until Tiptap mounts in the browser. */
export function ScriptToolbar({ editor }: { editor: Editor | null }) {
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

  return (
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
  );
}
