import { formatMoney } from '@/lib/sponsors/money';
import type { PipelineMonth } from '@/lib/sponsors/pipeline';

/** Booked, invoiced and paid per month, one row per currency: amounts in different currencies are never added. */
export function PipelineTable({ rows }: { rows: PipelineMonth[] }) {
  if (rows.length === 0) return null;
  return (
    <section aria-labelledby="pipeline-heading" className="mt-8">
      <h2 id="pipeline-heading" className="mb-3 text-lg font-bold">
        Pipeline per month
      </h2>
      {/* Focusable so a keyboard can scroll it on a narrow screen (axe: scrollable-region-focusable). */}
      <div tabIndex={0} role="region" aria-label="Pipeline per month, scrollable" className="overflow-x-auto rounded-card border border-paper-edge bg-white/60">
        <table className="stack-on-phone w-full text-left text-sm sm:min-w-[32rem]">
          <thead className="border-b border-paper-edge bg-paper-deep/60">
            <tr>
              {['Month', 'Currency', 'Booked', 'Invoiced', 'Paid'].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-bold">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-edge">
            {rows.map((r) => (
              <tr key={`${r.month}-${r.currency}`}>
                <td data-label="Month" className="px-3 py-2 font-mono">{r.month}</td>
                <td data-label="Currency" className="px-3 py-2 font-mono">{r.currency}</td>
                <td data-label="Booked" className="px-3 py-2 font-mono">{formatMoney(r.bookedMinor, r.currency)}</td>
                <td data-label="Invoiced" className="px-3 py-2 font-mono">{formatMoney(r.invoicedMinor, r.currency)}</td>
                <td data-label="Paid" className="px-3 py-2 font-mono">{formatMoney(r.paidMinor, r.currency)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-ink-faint">Booked in the month of the first go-live, invoiced when the invoice went out, paid when the money came in.</p>
    </section>
  );
}
