'use client';

import { useId, useRef, useState, type ReactNode } from 'react';
import { ApiError } from '@/lib/api/client';
import { shotStateLabels, type ShotState } from '@/lib/shots/catalog';
import type { BoardShotDto } from '@/lib/shots/schemas';
import { RetakeDialog } from './retake-dialog';
import { useChangeShotState, type StateChange } from './use-shop-board';

export type Failure = { shotId: string; message: string };

type RetakeRequest = { shot: BoardShotDto; afterId?: string | null; resolve: () => void };

/**
 * State changes for every shot view: optimistic moves, the server's refusal as a message,
 * and the reason dialog that every Retake goes through.
 */
export function useShotActions(slug: string, viewerName: string) {
  const change = useChangeShotState(slug, viewerName);
  const [failure, setFailure] = useState<Failure | null>(null);
  const [retake, setRetake] = useState<RetakeRequest | null>(null);

  const failed = (v: StateChange, err: unknown) =>
    setFailure({
      shotId: v.shot.id,
      message: `Could not mark “${v.shot.description}” ${shotStateLabels[v.state]}: ${err instanceof Error ? err.message : 'the server did not answer.'}`,
    });

  // mutateAsync per change, so a refusal is reported for each one, not only for the last of several.
  const move = (v: StateChange) => {
    setFailure(null);
    change(v).catch((err: unknown) => failed(v, err));
  };

  const askRetake = (shot: BoardShotDto, afterId?: string | null) => {
    setFailure(null);
    return new Promise<void>((resolve) => setRetake({ shot, ...(afterId !== undefined && { afterId }), resolve }));
  };

  const close = () => {
    retake?.resolve();
    setRetake(null);
  };

  async function submitRetake(reason: string): Promise<string | null> {
    if (!retake) return null;
    const v: StateChange = { shot: retake.shot, state: 'retake', reason, ...(retake.afterId !== undefined && { afterId: retake.afterId }) };
    try {
      await change(v);
    } catch (err) {
      // A wrong reason stays in the dialog with the server's words; anything else closes it and says why.
      if (err instanceof ApiError && err.fields.reason) return err.fields.reason;
      failed(v, err);
    }
    close();
    return null;
  }

  const dialog: ReactNode = retake ? <RetakeDialog key={retake.shot.id} shot={retake.shot} onSubmit={submitRetake} onCancel={close} /> : null;

  return { move, askRetake, failure, dismiss: () => setFailure(null), dialog };
}

export type ShotActions = ReturnType<typeof useShotActions>;

const bigButton =
  'inline-flex min-h-touch flex-1 items-center justify-center gap-1.5 rounded-md px-3 text-base font-bold transition-colors disabled:cursor-not-allowed';

const pressedStyles: Record<ShotState, string> = {
  planned: '',
  captured: 'aria-pressed:bg-ok aria-pressed:text-white aria-pressed:border-ok',
  retake: 'aria-pressed:bg-attention aria-pressed:text-white aria-pressed:border-attention',
};

/** Large buttons for a phone in a dusty shop: Captured, Retake, and back to Planned once it is one of those. */
export function StateButtons({ shot, actions }: { shot: BoardShotDto; actions: ShotActions }) {
  const capturedRef = useRef<HTMLButtonElement>(null);
  const reasonId = useId();
  const error = actions.failure?.shotId === shot.id ? actions.failure.message : null;
  // The server refuses Captured until the review (lib/shots/queries.ts); say so before anyone presses (issue 15).
  const waitsForReview = shot.safetyPending && shot.state !== 'captured';
  return (
    <div className="space-y-2 pt-1">
      <div className="flex gap-2">
        <button
          type="button"
          ref={capturedRef}
          aria-label={`Mark captured: ${shot.description}`}
          aria-pressed={shot.state === 'captured'}
          disabled={waitsForReview}
          aria-describedby={waitsForReview ? reasonId : undefined}
          onClick={() => {
            if (shot.state !== 'captured') actions.move({ shot, state: 'captured' });
          }}
          className={`${bigButton} border border-ok/60 bg-white text-ok hover:bg-ok-soft disabled:border-ink/20 disabled:bg-paper-deep disabled:text-ink-faint disabled:hover:bg-paper-deep ${pressedStyles.captured}`}
        >
          <CheckIcon />
          Captured
        </button>
        <button
          type="button"
          aria-label={`Mark retake: ${shot.description}`}
          aria-pressed={shot.state === 'retake'}
          onClick={() => void actions.askRetake(shot)}
          className={`${bigButton} border border-attention/60 bg-white text-attention-ink hover:bg-attention-soft ${pressedStyles.retake}`}
        >
          <RetakeIcon />
          Retake
        </button>
      </div>
      {waitsForReview ? (
        <p id={reasonId} className="text-sm text-ink-soft">
          Captured waits for the safety review of this segment’s tools. A Host can review it on the segment page.
        </p>
      ) : null}
      {shot.state !== 'planned' ? (
        <button
          type="button"
          aria-label={`Back to Planned: ${shot.description}`}
          onClick={() => {
            // This button goes away with the change; keep focus on the same card.
            capturedRef.current?.focus();
            actions.move({ shot, state: 'planned' });
          }}
          className={`${bigButton} w-full border border-ink/25 bg-white/60 text-sm text-ink-soft hover:bg-white`}
        >
          Back to Planned
        </button>
      ) : null}
      {error ? (
        <div role="alert" className="flex items-start justify-between gap-2 rounded-md border-l-4 border-attention bg-attention-soft px-3 py-2 text-sm text-attention-ink">
          <span>{error}</span>
          <button type="button" onClick={actions.dismiss} className="-my-1 min-h-touch shrink-0 rounded-md px-2 font-bold hover:bg-white/60">
            Dismiss
          </button>
        </div>
      ) : null}
    </div>
  );
}

function CheckIcon() {
  return (
    <svg aria-hidden="true" width="16" height="16" viewBox="0 0 16 16">
      <path d="M3 8.5l3.2 3.2L13 4.8" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}

function RetakeIcon() {
  return (
    <svg aria-hidden="true" width="16" height="16" viewBox="0 0 16 16">
      <path d="M12.5 6.5A5 5 0 1 0 13 9" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      <path d="M13 2.5v4h-4" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
