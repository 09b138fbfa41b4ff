import { ScriptView } from '@/components/script/script-view';
import { EmptyState } from '@/components/ui/empty-state';
import { deliverableKindLabels, type EditorDeliverableDto } from '@/lib/sponsors/schemas';

/** The Editor's view: what each sponsor read must say and its disclosure; no fees, no terms. */
export function EditorDeliverables({ deliverables, channelSlug }: { deliverables: EditorDeliverableDto[]; channelSlug: string }) {
  if (deliverables.length === 0) {
    return <EmptyState title="No sponsor reads to cut">When the Host books a sponsor read in an episode, its talking points and disclosure show here.</EmptyState>;
  }
  return (
    <ul className="space-y-4">
      {deliverables.map((d) => (
        <li key={d.id} className="rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
          <h2 className="font-bold">
            {d.sponsorName} · {deliverableKindLabels[d.kind]}
          </h2>
          <p className="mb-3 text-sm text-ink-soft">
            <a href={`/c/${channelSlug}/episodes/${d.episodeId}`} className="text-blueprint underline">
              {d.episodeTitle}
            </a>
            {d.segmentTitle ? ` · ${d.segmentTitle}` : ''}
          </p>
          <h3 className="text-sm font-bold">Disclosure</h3>
          <p className="mb-3">{d.disclosure || <span className="italic text-ink-faint">No disclosure wording yet.</span>}</p>
          <h3 className="text-sm font-bold">Talking points</h3>
          <ScriptView doc={d.talkingPoints} />
        </li>
      ))}
    </ul>
  );
}
