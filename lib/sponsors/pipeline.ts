import type { InvoiceState } from './schemas';

export type PipelineDeal = {
  feeMinor: number;
  currency: string;
  invoiceState: InvoiceState;
  invoiceSentOn: string | null;
  paidOn: string | null;
  /** The earliest go-live of the deal's deliverables; the deal counts as booked in that month. */
  goLive: string | null;
  /** When no go-live is set yet, the month the deal was entered. */
  createdOn: string;
};
export type PipelineMonth = { month: string; currency: string; bookedMinor: number; invoicedMinor: number; paidMinor: number };

/**
 * Totals per month and currency, never summed across currencies: booked in the go-live month,
 * invoiced in the month the invoice went out, paid in the month the money came in.
 */
export function pipelineByMonth(deals: readonly PipelineDeal[]): PipelineMonth[] {
  const rows = new Map<string, PipelineMonth>();
  const at = (date: string, currency: string) => {
    const month = date.slice(0, 7);
    const key = `${month} ${currency}`;
    let row = rows.get(key);
    if (!row) rows.set(key, (row = { month, currency, bookedMinor: 0, invoicedMinor: 0, paidMinor: 0 }));
    return row;
  };
  for (const d of deals) {
    at(d.goLive ?? d.createdOn, d.currency).bookedMinor += d.feeMinor;
    if (d.invoiceSentOn && d.invoiceState !== 'not_sent') at(d.invoiceSentOn, d.currency).invoicedMinor += d.feeMinor;
    if (d.paidOn && d.invoiceState === 'paid') at(d.paidOn, d.currency).paidMinor += d.feeMinor;
  }
  return [...rows.values()].sort((a, b) => a.month.localeCompare(b.month) || a.currency.localeCompare(b.currency));
}
