import { compareToTarget, layoutRuntimeBar, type TargetStatus } from '@/lib/runtime/bar';
import { formatDuration, type EpisodeForecast } from '@/lib/runtime';
import { kindLabels, segmentKinds, type SegmentDto, type SegmentKind } from '@/lib/segments/schemas';

// Calm, distinct fills per kind; attention stays reserved for the over-target message.
export const kindSwatches: Record<SegmentKind, string> = {
  cold_open: 'bg-ink-soft',
  build: 'bg-sawdust',
  sponsor_read: 'bg-blueprint',
  interlude: 'bg-ok',
  outro: 'bg-blueprint-line',
};

const pct = (fraction: number) => `${(fraction * 100).toFixed(3)}%`;

export function RuntimeBar({
  segments,
  forecast,
  targetSeconds,
}: {
  segments: readonly SegmentDto[];
  forecast: EpisodeForecast;
  targetSeconds: number | null;
}) {
  const totals = new Map(forecast.segments.map((f) => [f.id, f.totalSeconds]));
  const layout = layoutRuntimeBar(
    segments.map((s) => ({ id: s.id, totalSeconds: totals.get(s.id) ?? 0 })),
    targetSeconds,
  );
  const byId = new Map(segments.map((s) => [s.id, s]));
  const status = compareToTarget(layout.totalSeconds, targetSeconds);
  const total = formatDuration(layout.totalSeconds);
  const headline =
    status.kind === 'no_target' ? `Forecast ${total}` : `Forecast ${total} of ${formatDuration(targetSeconds ?? 0)} target`;
  const kindsShown = segmentKinds.filter((k) => layout.slices.some((s) => byId.get(s.id)?.kind === k));
  const summary = [
    `${headline}.`,
    statusSentence(status),
    ...layout.slices.map((s) => {
      const seg = byId.get(s.id);
      return seg ? `${seg.title} (${kindLabels[seg.kind]}) ${formatDuration(s.seconds)}.` : '';
    }),
  ].join(' ');

  return (
    <section aria-labelledby="runtime-heading" className="rounded-card border border-paper-edge bg-white/60 p-4 shadow-card sm:p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2 id="runtime-heading" className="text-sm font-bold uppercase tracking-wide text-ink-soft">
          Runtime forecast
        </h2>
        <TargetMessage status={status} />
      </div>
      <p className="mt-1 text-xl font-bold">
        Forecast <span className="font-mono">{total}</span>
        {status.kind !== 'no_target' ? (
          <span className="text-ink-soft">
            {' '}
            of <span className="font-mono">{formatDuration(targetSeconds ?? 0)}</span> target
          </span>
        ) : null}
      </p>

      {layout.totalSeconds === 0 ? (
        <p className="mt-3 rounded-md border border-dashed border-paper-edge px-3 py-2 text-sm text-ink-soft">
          Nothing to forecast yet: write scripts or set action time.
        </p>
      ) : (
        <>
          <div role="img" aria-label={summary} className="relative mt-3 h-8 overflow-visible rounded-md bg-paper-deep">
            <div className="absolute inset-0 overflow-hidden rounded-md">
              {layout.slices.map((s) => {
                const seg = byId.get(s.id);
                return (
                  <div
                    key={s.id}
                    title={seg ? `${seg.title}: ${formatDuration(s.seconds)}` : formatDuration(s.seconds)}
                    className={`absolute inset-y-0 border-r-2 border-white last:border-r-0 ${seg ? kindSwatches[seg.kind] : 'bg-ink-faint'}`}
                    style={{ left: pct(s.offset), width: pct(s.width) }}
                  />
                );
              })}
            </div>
            {layout.targetAt !== null && layout.targetAt < 1 ? (
              // The target line only shows when the forecast runs past it; otherwise the bar's end is the target.
              <div aria-hidden="true" className="absolute -inset-y-1 w-0.5 bg-attention" style={{ left: pct(layout.targetAt) }} />
            ) : null}
          </div>
          <div aria-hidden="true" className="mt-1 flex justify-between font-mono text-xs text-ink-faint">
            <span>00:00</span>
            <span>{formatDuration(layout.scaleSeconds)}</span>
          </div>
          <ul aria-label="Colours by segment kind" className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
            {kindsShown.map((k) => (
              <li key={k} className="flex items-center gap-1.5">
                <span aria-hidden="true" className={`inline-block size-3 rounded-sm ${kindSwatches[k]}`} />
                {kindLabels[k]}
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

function statusSentence(status: TargetStatus): string {
  switch (status.kind) {
    case 'no_target':
      return 'No target runtime set.';
    case 'empty':
      return 'Nothing forecast yet.';
    case 'on_target':
      return 'On target.';
    case 'over':
      return `Over target by ${formatDuration(status.bySeconds)}.`;
    case 'under':
      return `Under target by ${formatDuration(status.bySeconds)}.`;
  }
}

function TargetMessage({ status }: { status: TargetStatus }) {
  switch (status.kind) {
    case 'no_target':
      return <p className="text-sm text-ink-soft">No target runtime set</p>;
    case 'empty':
      return <p className="text-sm text-ink-soft">Nothing forecast yet</p>;
    case 'on_target':
      return <p className="text-sm font-bold text-ok">On target</p>;
    case 'under':
      return (
        <p className="text-sm font-bold text-ok">
          Under target by <span className="font-mono">{formatDuration(status.bySeconds)}</span>
        </p>
      );
    case 'over':
      return (
        <p className="rounded-full bg-attention-soft px-2.5 py-0.5 text-sm font-bold text-attention-ink">
          Over target by <span className="font-mono">{formatDuration(status.bySeconds)}</span>
        </p>
      );
  }
}
