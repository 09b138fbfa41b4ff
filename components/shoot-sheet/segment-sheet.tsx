import Link from 'next/link';
import { CautionsList } from '@/components/shots/cautions-list';
import type { EpisodeDto } from '@/lib/episodes/schemas';
import { kindLabels } from '@/lib/segments/schemas';
import type { ShootSheetSegment } from '@/lib/shots/shoot-sheet';
import { shortDate } from './dates';
import { PartsTable } from './parts-table';
import { ShotsTable } from './shots-table';

type Props = { item: ShootSheetSegment; levelLabels: EpisodeDto['levelLabels']; lengthUnit: 'in' | 'mm'; cutPlanHref: string };

export function SegmentSheet({ item, levelLabels, lengthUnit, cutPlanHref }: Props) {
  const { segment, position, shots, otherDayShots, parts, safety } = item;
  const headingId = `segment-${segment.id}`;
  const level = segment.kind === 'build' && segment.level !== null ? ` · Level ${segment.level} · ${levelLabels[segment.level - 1] ?? ''}` : '';
  return (
    <section aria-labelledby={headingId} className="border-t-4 border-ink pt-3">
      <div className="break-after-avoid">
        <p className="text-xs font-bold uppercase tracking-wide text-ink-soft">
          <span className="font-mono text-ink-faint">
            <span className="sr-only">Position </span>
            {String(position).padStart(2, '0')}
          </span>{' '}
          · {kindLabels[segment.kind]}
          {level}
        </p>
        <h2 id={headingId} className="text-xl font-bold leading-snug">
          {segment.title}
        </h2>
      </div>

      <div className="mt-3 space-y-1">
        <h3 className="sr-only">Shots</h3>
        {shots.length > 0 ? <ShotsTable shots={shots} segmentTitle={segment.title} /> : <p className="text-sm text-ink-soft">No shots on this day.</p>}
        {otherDayShots > 0 ? (
          <p className="text-xs text-ink-faint">
            {otherDayShots} {otherDayShots === 1 ? 'shot is' : 'shots are'} due on another day and left off this sheet.
          </p>
        ) : null}
      </div>

      <div className="mt-4 grid gap-4 md:grid-cols-2 print:grid-cols-2">
        {segment.kind === 'build' ? (
          <div className="break-inside-avoid">
            <div className="mb-1 flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="text-sm font-bold uppercase tracking-wide">Parts</h3>
              <Link href={cutPlanHref} className="inline-flex min-h-touch items-center text-sm text-blueprint underline print:hidden">
                Cut plan
              </Link>
            </div>
            {parts.length > 0 ? <PartsTable parts={parts} unit={lengthUnit} segmentTitle={segment.title} /> : <p className="text-sm text-ink-soft">No parts listed for this build.</p>}
          </div>
        ) : null}
        <div className="break-inside-avoid space-y-2">
          <h3 className="text-sm font-bold uppercase tracking-wide">Tools and cautions</h3>
          {safety.tools.length > 0 ? (
            <>
              <CautionsList tools={safety.tools} otherTool={safety.otherTool} />
              <SafetyLine safety={safety} />
            </>
          ) : (
            <p className="text-sm text-ink-soft">
              No tools listed. <span className="font-bold text-ink">Safety review:</span> not needed.
            </p>
          )}
        </div>
      </div>
    </section>
  );
}

function SafetyLine({ safety }: { safety: ShootSheetSegment['safety'] }) {
  if (!safety.needsReview) {
    return (
      <p className="text-sm">
        <span className="font-bold">Safety review:</span> not needed, none of these are power tools.
      </p>
    );
  }
  if (safety.reviewedAt) {
    return (
      <p className="text-sm text-ok">
        <span className="font-bold">Safety review: done</span>
        {safety.reviewedBy ? ` by ${safety.reviewedBy}` : ''} on {shortDate(safety.reviewedAt)}.
      </p>
    );
  }
  return (
    <p className="rounded-md bg-attention-soft px-2 py-1 text-sm text-attention-ink">
      <span className="font-bold">Safety review: not done yet.</span> A Host reviews the power tools before any shot of this segment can be marked Captured.
    </p>
  );
}
