import { DISCLOSURE_CAUTION, type CheckResult, type CheckStatus } from '@/lib/sponsor-checks';

const names: Record<CheckResult['name'], string> = { placement: 'Placement', length: 'Read length', mustSay: 'Must-say phrases', disclosure: 'Disclosure' };
const marks: Record<CheckStatus, { label: string; classes: string }> = {
  pass: { label: 'Pass', classes: 'bg-ok-soft text-ok' },
  fail: { label: 'Fails', classes: 'bg-attention-soft text-attention-ink' },
  unknown: { label: 'Not set', classes: 'bg-paper-deep text-ink-soft' },
};

/** The read's checks against the script and the runtime forecast; failures in the attention colour. */
export function SponsorChecksList({ checks, title = 'Checks against the script' }: { checks: CheckResult[]; title?: string }) {
  return (
    <section aria-label={title} className="rounded-md border border-paper-edge bg-white/70 p-4">
      <h4 className="mb-2 text-sm font-bold">{title}</h4>
      <ul className="space-y-2 text-sm">
        {checks.map((c) => (
          <li key={c.name} className="flex flex-wrap items-start gap-2" data-check={c.name} data-status={c.status}>
            <span className={`inline-flex min-w-16 justify-center rounded px-2 py-0.5 text-xs font-bold ${marks[c.status].classes}`}>{marks[c.status].label}</span>
            <span className="font-bold">{names[c.name]}</span>
            <span className="basis-full text-ink-soft sm:basis-auto">{c.message}</span>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-xs text-ink-faint">{DISCLOSURE_CAUTION}</p>
    </section>
  );
}
