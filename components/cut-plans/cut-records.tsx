'use client';

import { useEffect, useRef } from 'react';
import { Badge } from '@/components/ui/badge';
import { offcutSize, type CutRecordDto } from '@/lib/cut-plans/cut-records';
import { newestRecordIds } from '@/lib/cut-plans/take-back';
import { countOf } from '@/lib/text/count-of';
import { formatLength } from '@/lib/units';
import { BoardDiagram } from './board-diagram';
import { money } from './cut-plan-view';
import { TakeBackCuts, type TakeBack } from './take-back-cuts';

// UTC, so the server's render and the browser's agree.
const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

type Props = {
  records: CutRecordDto[];
  unit: 'in' | 'mm';
  /** "Take back" on the newest record of each stock item, for those who may mark cuts done. */
  takeBack?: TakeBack | undefined;
  /** What the last "Take back" did; shown here even when it took back the last record. */
  note?: string | undefined;
};

/** What an episode's "Mark these cuts done" recorded: per stock item, what was cut, pulled, bought and kept. */
export function CutRecords({ records, unit, takeBack, note }: Props) {
  // After "Take back" the record (and the button that had focus) is gone: focus moves to what it did.
  const noteRef = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    if (note) noteRef.current?.focus();
  }, [note]);
  if (records.length === 0 && !note) return null;
  const fmt = (n: number) => formatLength(n, { unit });
  // Each record was planned from what the ones before it left: only the newest of a stock item can go.
  const newest = newestRecordIds(records);
  return (
    <section aria-labelledby="cuts-done-heading" className="space-y-3">
      <h2 id="cuts-done-heading" className="text-lg font-bold">
        Cuts done
      </h2>
      <p ref={noteRef} tabIndex={-1} role="status" className={note ? 'rounded-md bg-ok-soft px-4 py-2 text-sm text-ok' : 'sr-only'}>
        {note}
      </p>
      {records.length > 0 ? (
        <p className="text-sm text-ink-soft">
          These pieces are cut; the plan above covers only what is left.
          {takeBack ? ' Marked done by mistake? Take back the newest cuts done of a stock item; older ones wait until the newer are taken back.' : ''}
        </p>
      ) : null}
      <ul className="space-y-3">
        {records.map((r) => {
          const sheet = r.plan.stock.kind === 'sheet';
          const pieces = r.plan.boards.reduce((a, b) => a + b.pieces.length, 0);
          const pulled = r.plan.pulled.reduce((a, p) => a + p.count, 0);
          const kept = r.plan.boards.filter((b) => b.keepOffcut);
          return (
            <li key={r.id} className="rounded-card border border-paper-edge bg-white/60 p-4">
              <p className="flex flex-wrap items-center gap-2">
                <Badge tone="ok">Cut</Badge>
                <span className="font-bold">{r.plan.stock.name}</span>
                <span className="text-sm text-ink-soft">
                  {day.format(new Date(r.doneAt))}
                  {r.doneByName ? `, ${r.doneByName}` : ''}
                </span>
              </p>
              <p className="mt-1 text-sm">
                {countOf(pieces, 'piece', 'pieces')} from {sheet ? countOf(r.plan.boards.length, 'sheet', 'sheets') : countOf(r.plan.boards.length, 'board', 'boards')}: {pulled} pulled from the rack, {r.plan.boards.length - pulled} bought ({money(r.plan.costCents)}).{' '}
                {kept.length > 0 ? (
                  <>
                    Kept on hand: <span className="font-mono">{kept.map((b) => offcutSize(b, fmt)).join(', ')}</span>.
                  </>
                ) : (
                  'No offcut kept.'
                )}
              </p>
              <details className="mt-2">
                <summary className="min-h-touch cursor-pointer py-2 text-sm text-blueprint underline">Show the boards as cut</summary>
                <ol className="mt-2 space-y-3">
                  {r.plan.boards.map((b, i) => (
                    <li key={i}>
                      <BoardDiagram board={b} sheet={sheet} unit={unit} title={`${sheet ? 'Sheet' : 'Board'} ${i + 1}${b.onHandId ? ' (from the rack)' : ''}: ${sheet ? `${fmt(b.widthIn)} × ` : ''}${fmt(b.lengthIn)}`} />
                    </li>
                  ))}
                </ol>
              </details>
              {takeBack && newest.has(r.id) ? <TakeBackCuts record={r} takeBack={takeBack} /> : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
