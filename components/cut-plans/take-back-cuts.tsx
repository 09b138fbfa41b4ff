'use client';

import { useEffect, useRef, useState } from 'react';
import { Button, buttonClasses } from '@/components/ui/button';
import type { CutRecordDto } from '@/lib/cut-plans/cut-records';
import { takeBackSummary } from '@/lib/cut-plans/take-back';
import { countOf } from '@/lib/text/count-of';

export type TakeBack = {
  onTakeBack: (recordId: string) => void;
  pendingId: string | null;
  /** Why the server refused to take a record back, shown on that record. */
  refusal: { recordId: string; message: string } | null;
};

/** What taking a record back does, in numbers: "puts 2 boards back on the rack, removes the 1 offcut it kept, unticks 6 pieces". */
export function takeBackSentence(record: Pick<CutRecordDto, 'plan'>): string {
  const s = takeBackSummary(record.plan);
  const sheet = record.plan.stock.kind === 'sheet';
  const parts = [
    s.piecesBack > 0 ? `puts ${countOf(s.piecesBack, sheet ? 'sheet' : 'board', sheet ? 'sheets' : 'boards')} back on the rack` : 'puts nothing back on the rack (every board was bought)',
    s.offcutsRemoved > 0 ? `removes the ${countOf(s.offcutsRemoved, 'offcut', 'offcuts')} it kept from what is on hand` : 'removes no offcut (none was kept)',
    `unticks ${countOf(s.piecesUnticked, 'piece', 'pieces')} on the cut list`,
  ];
  return `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}`;
}

/**
 * "Take back" on the newest cuts done of a stock item: the undo of a mis-pressed "Mark these cuts done",
 * asked twice because it moves stock. Only the newest record of each stock item offers it (each record
 * was planned from what the ones before it left); the server also refuses while an offcut it kept is
 * no longer on hand as kept, and that refusal shows here.
 */
export function TakeBackCuts({ record, takeBack }: { record: CutRecordDto; takeBack: TakeBack }) {
  const [asking, setAsking] = useState(false);
  // Keyboard: opening the question moves focus into it (onto Cancel, the safe answer); Cancel brings it back.
  const opener = useRef<HTMLButtonElement>(null);
  const cancel = useRef<HTMLButtonElement>(null);
  const wasAsking = useRef(false);
  useEffect(() => {
    if (asking) cancel.current?.focus();
    else if (wasAsking.current) opener.current?.focus();
    wasAsking.current = asking;
  }, [asking]);
  const pending = takeBack.pendingId === record.id;
  const refusal = takeBack.refusal?.recordId === record.id ? takeBack.refusal.message : null;
  // The confirmation that had focus is gone by the time a refusal comes back: focus goes to the refusal,
  // so a keyboard user is not left at the top of the page.
  const refusalRef = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    if (refusal) refusalRef.current?.focus();
  }, [refusal]);
  const name = record.plan.stock.name;
  return (
    <div className="mt-3 print:hidden">
      {asking ? (
        <div role="group" aria-label={`Take back the cuts of ${name}`} className="rounded-md border border-ink/20 bg-paper-deep/60 p-3 text-sm">
          <p>
            Take back these cuts of {name}? This {takeBackSentence(record)}. Use it when the cuts were marked done by mistake or are not really done yet.
          </p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button
              onClick={() => {
                setAsking(false);
                takeBack.onTakeBack(record.id);
              }}
            >
              Yes, take back
            </Button>
            <button ref={cancel} type="button" className={buttonClasses('quiet')} onClick={() => setAsking(false)}>
              Cancel
            </button>
          </div>
        </div>
      ) : (
        <button ref={opener} type="button" className={buttonClasses('secondary')} disabled={pending} onClick={() => setAsking(true)} aria-label={`Take back the cuts of ${name}`}>
          {pending ? 'Taking back…' : 'Take back'}
        </button>
      )}
      {refusal ? (
        <p ref={refusalRef} tabIndex={-1} role="alert" className="mt-2 rounded-md border-l-4 border-attention bg-attention-soft px-3 py-2 text-sm text-attention-ink">
          {refusal}
        </p>
      ) : null}
    </div>
  );
}
