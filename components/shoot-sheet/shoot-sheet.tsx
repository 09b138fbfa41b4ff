import { EmptyState } from '@/components/ui/empty-state';
import type { ShootSheetDto } from '@/lib/shots/shoot-sheet';
import { longDate } from './dates';
import { SegmentSheet } from './segment-sheet';
import { channelPage } from '@/lib/api/paths';

// On paper: black on white, no shadows or tinted boxes; colour only says what the words already say.
const paper = 'print:text-black print:**:border-black print:**:bg-transparent print:**:text-black print:**:shadow-none';

export function ShootSheet({ sheet, channelSlug }: { sheet: ShootSheetDto; channelSlug: string }) {
  const { episode, date, segments } = sheet;
  if (segments.length === 0) {
    return (
      <EmptyState title="No segments yet.">
        This episode has no running order yet, so there is nothing to shoot. A Host plans the segments on the episode page.
      </EmptyState>
    );
  }
  const shotCount = segments.reduce((n, s) => n + s.shots.length, 0);
  const otherDays = segments.reduce((n, s) => n + s.otherDayShots, 0);
  const cutPlanHref = channelPage(channelSlug, 'episodes', episode.id, 'cut-plan');
  // Before the day, where a review still helps (issue 15): the segments whose shots cannot be marked Captured yet.
  const waiting = segments.filter((s) => s.safety.needsReview && !s.safety.reviewedAt);
  return (
    <div className={paper}>
      <p className="mb-4 text-sm text-ink-soft">
        {shotCount} {shotCount === 1 ? 'shot' : 'shots'} in {segments.length} {segments.length === 1 ? 'segment' : 'segments'}
        {otherDays > 0 ? ` · ${otherDays} due on other days left out` : ''}
      </p>
      {waiting.length > 0 ? (
        <section aria-labelledby="pending-reviews-heading" className="mb-6 rounded-card border-l-4 border-attention bg-attention-soft px-4 py-3 text-sm text-attention-ink">
          <h2 id="pending-reviews-heading" className="font-bold">
            {waiting.length === 1 ? '1 segment waits' : `${waiting.length} segments wait`} for a safety review
          </h2>
          <p>A Host reviews the power tools before the shoot; until then these shots cannot be marked Captured.</p>
          <ul className="mt-1 list-disc pl-5">
            {waiting.map((s) => (
              <li key={s.segment.id}>
                <a href={channelPage(channelSlug, 'episodes', episode.id, 'segments', s.segment.id)} className="inline-flex min-h-touch items-center font-bold underline">
                  {s.segment.title}
                </a>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {shotCount === 0 && date ? (
        <div className="mb-6 rounded-card border-2 border-dashed border-paper-edge bg-white/40 px-4 py-4 text-sm text-ink-soft">
          <p className="font-bold text-ink">No shots on {longDate(date)}.</p>
          <p>Every shot of this episode is due on another day. Parts and tool cautions are still listed below.</p>
        </div>
      ) : null}
      <ol aria-label="Segments in running order" className="space-y-8 print:space-y-6">
        {segments.map((s) => (
          <li key={s.segment.id}>
            <SegmentSheet item={s} levelLabels={episode.levelLabels} lengthUnit={sheet.lengthUnit} cutPlanHref={cutPlanHref} />
          </li>
        ))}
      </ol>
    </div>
  );
}
