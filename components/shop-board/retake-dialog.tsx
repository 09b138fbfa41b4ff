'use client';

import { useEffect, useId, useRef, useState, type FormEvent, type KeyboardEvent } from 'react';
import { Button } from '@/components/ui/button';
import { shotLabel, type BoardShotDto } from '@/lib/shots/schemas';

const MAX_REASON = 300;
const focusable = 'button:not([disabled]), textarea:not([disabled]), input:not([disabled]), select:not([disabled]), a[href], [tabindex]:not([tabindex="-1"])';

type Props = {
  shot: BoardShotDto;
  /** Resolves to the server's message for the reason field, or null once the retake is saved or given up. */
  onSubmit: (reason: string) => Promise<string | null>;
  onCancel: () => void;
};

/** Asks why a shot needs a retake. A modal <dialog>: the page behind it is inert, Escape cancels. */
export function RetakeDialog({ shot, onSubmit, onCancel }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const closedRef = useRef(false);
  const [reason, setReason] = useState(shot.state === 'retake' ? (shot.retakeReason ?? '') : '');
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const titleId = useId();
  const fieldId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    const previous = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    if (!dialog.open) dialog.showModal();
    return () => {
      if (dialog.open) dialog.close();
      if (previous?.isConnected) previous.focus();
    };
  }, []);

  const cancel = () => {
    if (closedRef.current) return;
    closedRef.current = true;
    onCancel();
  };

  async function submit(e: FormEvent) {
    e.preventDefault();
    const text = reason.trim();
    if (!text) {
      setError('Say why it needs a retake.');
      return;
    }
    setPending(true);
    setError(null);
    const fieldError = await onSubmit(text);
    if (fieldError) {
      setError(fieldError);
      setPending(false);
    } else closedRef.current = true;
  }

  // showModal makes the page inert; this keeps Tab cycling inside the dialog instead of leaving for the browser.
  function trapTab(e: KeyboardEvent<HTMLDialogElement>) {
    if (e.key !== 'Tab' || !ref.current) return;
    const items = [...ref.current.querySelectorAll<HTMLElement>(focusable)];
    const first = items[0];
    const last = items[items.length - 1];
    if (!first || !last) return;
    if (e.shiftKey && document.activeElement === first) {
      e.preventDefault();
      last.focus();
    } else if (!e.shiftKey && document.activeElement === last) {
      e.preventDefault();
      first.focus();
    }
  }

  return (
    <dialog
      ref={ref}
      role="dialog"
      aria-modal="true"
      aria-labelledby={titleId}
      onKeyDown={trapTab}
      onCancel={(e) => {
        e.preventDefault();
        if (!pending) cancel();
      }}
      // Also fires after an effect re-run (Strict Mode) closed and reopened it; only a dialog left closed was cancelled.
      onClose={() => {
        if (!ref.current?.open) cancel();
      }}
      className="m-auto max-h-[calc(100dvh-2rem)] w-[min(30rem,calc(100vw-2rem))] rounded-card border border-paper-edge bg-paper p-0 text-ink shadow-xl backdrop:bg-ink/50"
    >
      <form onSubmit={submit} className="space-y-4 p-5" noValidate>
        <div>
          <h2 id={titleId} className="text-lg font-bold">
            Mark Retake
          </h2>
          <p className="mt-1 text-sm text-ink-soft">
            Shot {shotLabel(shot)}: {shot.description}
            <span className="block text-xs text-ink-faint">
              {shot.episodeTitle} / {shot.segmentTitle}
            </span>
          </p>
        </div>
        <div>
          <label htmlFor={fieldId} className="mb-1 block text-sm font-bold">
            Why a retake?
          </label>
          <textarea
            id={fieldId}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            maxLength={MAX_REASON}
            rows={3}
            required
            autoFocus
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${fieldId}-error` : `${fieldId}-hint`}
            placeholder="Out of focus, hand in frame, missed the glue squeeze-out…"
            className="block w-full rounded-md border border-ink/30 bg-white px-3 py-2 text-base text-ink placeholder:text-ink-faint aria-[invalid=true]:border-attention"
          />
          {error ? (
            <p id={`${fieldId}-error`} className="mt-1 text-sm font-bold text-attention-ink">
              {error}
            </p>
          ) : (
            <p id={`${fieldId}-hint`} className="mt-1 text-sm text-ink-faint">
              The shop hand reads this on the card. Up to {MAX_REASON} characters.
            </p>
          )}
        </div>
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={cancel} disabled={pending}>
            Cancel
          </Button>
          <Button type="submit" disabled={pending}>
            {pending ? 'Saving…' : 'Mark Retake'}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
