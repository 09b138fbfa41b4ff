'use client';

import type { JSONContent } from '@tiptap/react';
import { useEffect, useState, type RefObject } from 'react';
import { apiFetch } from '@/lib/api/client';
import { createAutosaver, type AutosaveSnapshot, type SaveOutcome } from '@/lib/scripts/autosave';
import type { SavedScriptDto } from '@/lib/scripts/schemas';

type Options = {
  /** The script route; a ref so a save after a re-render still goes to the current one. */
  urlRef: RefObject<string>;
  /** The newest text, kept outside the editor so a save can still read it after the editor is gone. */
  docRef: RefObject<JSONContent>;
  initialVersion: number;
  onSaved: (outcome: SaveOutcome) => void;
};

/**
 * The script's autosaver (lib/scripts/autosave.ts) wired to the page: it saves at once when the
 * connection returns, when the tab is hidden and on unmount, and asks before the page is left while
 * something is unsaved.
 */
export function useScriptAutosave({ urlRef, docRef, initialVersion, onSaved }: Options) {
  const [snapshot, setSnapshot] = useState<AutosaveSnapshot>({ status: { kind: 'saved' }, unsaved: false });

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
      onSaved,
    }),
  );

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

  return { autosaver, snapshot };
}
