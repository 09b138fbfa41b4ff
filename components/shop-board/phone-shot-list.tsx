'use client';

import { shotStateLabels, shotStates } from '@/lib/shots/catalog';
import type { BoardShotDto } from '@/lib/shots/schemas';
import { StateButtons, type ShotActions } from './shot-actions';
import { ShotCardBody } from './shot-card';

/**
 * The board on a phone: one list in board order, so a card stays put under the thumb when its
 * state changes, with large buttons instead of dragging.
 */
export function PhoneShotList({ slug, shots, actions }: { slug: string; shots: BoardShotDto[]; actions: ShotActions | null }) {
  const counts = shotStates.map((state) => ({ state, n: shots.filter((s) => s.state === state).length }));
  return (
    <section aria-label="Shots in board order" className="space-y-3 md:hidden">
      <p className="flex flex-wrap gap-x-3 text-sm text-ink-soft">
        {counts.map(({ state, n }) => (
          <span key={state} className={state === 'retake' && n > 0 ? 'font-bold text-attention-ink' : undefined}>
            {shotStateLabels[state]} <span className="font-mono tabular-nums">{n}</span>
          </span>
        ))}
      </p>
      <ol className="space-y-3">
        {shots.map((shot) => (
          <li key={shot.id}>
            <ShotCardBody slug={slug} shot={shot} showState footer={actions ? <StateButtons shot={shot} actions={actions} /> : null} />
          </li>
        ))}
      </ol>
    </section>
  );
}
