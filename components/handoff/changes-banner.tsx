import type { HandoffDiff } from '@/lib/handoffs/diff';
import { shotStateLabels } from '@/lib/shots/catalog';

/** "What changed since the version you last opened": one banner, in the attention colour. */
export function ChangesBanner({ diff }: { diff: HandoffDiff }) {
  const title = `Changed since v${diff.from}, the version you opened before`;
  if (diff.unchanged) {
    return (
      <section aria-label={title} className="mb-6 rounded-md border-l-4 border-blueprint-line bg-blueprint-soft px-4 py-3 text-sm text-blueprint">
        Nothing changed since v{diff.from}.
      </section>
    );
  }
  const items: string[] = [
    ...diff.segmentsAdded.map((s) => `Segment added: ${s.number}. ${s.title}`),
    ...diff.segmentsRemoved.map((s) => `Segment removed: ${s.title}`),
    ...diff.segmentsMoved.map((s) => `Segment moved: ${s.title} (was ${s.fromNumber}, now ${s.number})`),
    ...diff.shotsAdded.map((s) => `Shot added in ${s.segmentTitle}: ${s.description}`),
    ...diff.shotsRemoved.map((s) => `Shot removed from ${s.segmentTitle}: ${s.description}`),
    ...diff.shotsChanged.map((s) => `Shot ${shotStateLabels[s.fromState]} → ${shotStateLabels[s.toState]} in ${s.segmentTitle}: ${s.description}`),
    ...diff.clipsAdded.map((c) => `Clip added in ${c.segmentTitle}: ${c.name}`),
    ...diff.clipsRemoved.map((c) => `Clip removed from ${c.segmentTitle}: ${c.name}`),
  ];
  return (
    <section aria-labelledby="changes-heading" className="mb-6 rounded-md border-l-4 border-attention bg-attention-soft px-4 py-3 text-sm text-attention-ink print:border-black print:bg-white print:text-black">
      <h2 id="changes-heading" className="font-bold">
        {title}
      </h2>
      {items.length ? (
        <ul className="mt-1 list-disc pl-5">
          {items.map((t, i) => (
            <li key={i}>{t}</li>
          ))}
        </ul>
      ) : null}
      {diff.scripts.map(({ segment, words }) => (
        <div key={segment.id} className="mt-2">
          <p className="font-bold">Script of {segment.number}. {segment.title}</p>
          <p className="mt-1 rounded bg-white px-2 py-1 text-ink">
            {words.map((w, i) =>
              w.change === 'added' ? (
                <ins key={i} className="bg-ok-soft text-ok no-underline">
                  <span className="sr-only">added: </span>
                  {w.text}
                </ins>
              ) : w.change === 'removed' ? (
                <del key={i} className="text-attention-ink">
                  <span className="sr-only">removed: </span>
                  {w.text}
                </del>
              ) : (
                <span key={i}>{w.text}</span>
              ),
            )}
          </p>
        </div>
      ))}
    </section>
  );
}
