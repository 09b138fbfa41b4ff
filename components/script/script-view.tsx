import { renderToReactElement } from '@tiptap/static-renderer/pm/react';
import type { ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { scriptExtensions } from '@/lib/scripts/extensions';
import { plainTextOf } from '@/lib/scripts/plain-text';
import type { ScriptDoc } from '@/lib/scripts/schemas';
import { scriptProseClasses } from './script-prose';

/** The script, read-only, rendered on the server with the editor's own extensions. */
export function ScriptView({ doc }: { doc: ScriptDoc | null }) {
  if (!doc || plainTextOf(doc).trim() === '') {
    return <p className="italic text-ink-faint">No script yet.</p>;
  }
  let content: ReactNode;
  try {
    content = renderToReactElement({ content: doc, extensions: scriptExtensions });
  } catch (error) {
    // Stored scripts are validated on save, so this is a bug; the rest of the page still renders.
    console.error('ScriptView could not render a script', error);
    return <Alert tone="attention">This script could not be displayed.</Alert>;
  }
  return <div className={`max-w-prose ${scriptProseClasses}`}>{content}</div>;
}
