'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { SortableHead, type Sort, type SortColumn } from '@/components/ui/sortable-head';
import { formatMoney } from '@/lib/sponsors/money';
import { dueDateLabels, invoiceStateLabels, invoiceStates, type DealRowDto, type InvoiceState } from '@/lib/sponsors/schemas';
import { DueText } from './due-text';

type SortKey = 'sponsor' | 'episode' | 'fee' | 'nextDue' | 'state';
const columns: SortColumn<SortKey>[] = [
  { key: 'sponsor', label: 'Sponsor' },
  { key: 'episode', label: 'Episode' },
  { key: 'fee', label: 'Fee' },
  { key: 'nextDue', label: 'Next due date' },
  { key: 'state', label: 'State' },
];

const episodeTitles = (d: DealRowDto) => d.episodes.map((e) => e.title).join(', ');

function compare(a: DealRowDto, b: DealRowDto, key: SortKey): number {
  switch (key) {
    case 'sponsor':
      return a.sponsorName.localeCompare(b.sponsorName) || a.title.localeCompare(b.title);
    case 'episode':
      return episodeTitles(a).localeCompare(episodeTitles(b));
    // Fees in different currencies are not comparable: group by currency, then amount.
    case 'fee':
      return a.currency.localeCompare(b.currency) || a.feeMinor - b.feeMinor;
    case 'nextDue':
      if (!a.nextDue) return b.nextDue ? 1 : 0;
      if (!b.nextDue) return -1;
      return a.nextDue.dueOn.localeCompare(b.nextDue.dueOn);
    case 'state':
      return invoiceStates.indexOf(a.invoiceState) - invoiceStates.indexOf(b.invoiceState);
  }
}

export function DealsTable({ deals, channelSlug, today }: { deals: DealRowDto[]; channelSlug: string; today: string }) {
  const [sort, setSort] = useState<Sort<SortKey>>({ key: 'nextDue', dir: 1 });
  const [sponsor, setSponsor] = useState('all');
  const [state, setState] = useState<InvoiceState | 'all'>('all');
  const sponsors = useMemo(() => [...new Map(deals.map((d) => [d.sponsorId, d.sponsorName])).entries()].sort((a, b) => a[1].localeCompare(b[1])), [deals]);
  const rows = useMemo(
    () =>
      deals
        .filter((d) => (sponsor === 'all' || d.sponsorId === sponsor) && (state === 'all' || d.invoiceState === state))
        .sort((a, b) => compare(a, b, sort.key) * sort.dir),
    [deals, sponsor, state, sort],
  );
  return (
    <div>
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <div>
          <label htmlFor="deal-sponsor-filter" className="mb-1 block text-sm font-bold">
            Sponsor
          </label>
          <select id="deal-sponsor-filter" value={sponsor} onChange={(e) => setSponsor(e.target.value)} className="min-h-touch rounded-md border border-ink/30 bg-white px-3">
            <option value="all">All sponsors</option>
            {sponsors.map(([id, name]) => (
              <option key={id} value={id}>
                {name}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="deal-state-filter" className="mb-1 block text-sm font-bold">
            State
          </label>
          <select id="deal-state-filter" value={state} onChange={(e) => setState(e.target.value as InvoiceState | 'all')} className="min-h-touch rounded-md border border-ink/30 bg-white px-3">
            <option value="all">All states</option>
            {invoiceStates.map((s) => (
              <option key={s} value={s}>
                {invoiceStateLabels[s]}
              </option>
            ))}
          </select>
        </div>
      </div>
      {rows.length === 0 ? (
        <EmptyState title="No deals match">Try another sponsor or state.</EmptyState>
      ) : (
        <div className="rounded-card border border-paper-edge bg-white/60 sm:overflow-x-auto">
          <table className="stack-on-phone w-full text-left text-sm sm:min-w-[44rem]">
            <caption className="sr-only">Sponsor deals, sorted by {columns.find((c) => c.key === sort.key)?.label}</caption>
            <SortableHead columns={columns} sort={sort} onSort={setSort} />
            <tbody className="divide-y divide-paper-edge">
              {rows.map((d) => (
                <tr key={d.id} className="hover:bg-paper/60">
                  <td className="px-3 py-2">
                    <Link href={`/c/${channelSlug}/sponsors/${d.id}`} className="font-bold text-blueprint underline-offset-2 hover:underline">
                      {d.sponsorName}
                    </Link>
                    <p className="text-xs text-ink-soft">{d.title}</p>
                  </td>
                  <td data-label="Episode" className="px-3 py-2">{d.episodes.length ? episodeTitles(d) : <span className="text-ink-faint">No deliverable yet</span>}</td>
                  <td data-label="Fee" className="px-3 py-2 font-mono">{formatMoney(d.feeMinor, d.currency)}</td>
                  <td data-label="Next due date" className="px-3 py-2">
                    {d.nextDue ? (
                      <span>
                        <span className="block text-xs text-ink-soft">{dueDateLabels[d.nextDue.kind]}</span>
                        <DueText dueOn={d.nextDue.dueOn} today={today} />
                      </span>
                    ) : (
                      <span className="text-ink-faint">—</span>
                    )}
                  </td>
                  <td data-label="State" className="px-3 py-2">{invoiceStateLabels[d.invoiceState]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
