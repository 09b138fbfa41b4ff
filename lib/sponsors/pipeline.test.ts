import { describe, expect, it } from 'vitest';
import { pipelineByMonth, type PipelineDeal } from './pipeline';

const deal = (over: Partial<PipelineDeal>): PipelineDeal => ({
  feeMinor: 100_00,
  currency: 'USD',
  invoiceState: 'not_sent',
  invoiceSentOn: null,
  paidOn: null,
  goLive: null,
  createdOn: '2027-01-05',
  ...over,
});

describe('pipelineByMonth', () => {
  it('books by go-live, invoices by sent date, pays by paid date, per currency', () => {
    const rows = pipelineByMonth([
      deal({ feeMinor: 250_000, goLive: '2027-03-10', invoiceState: 'paid', invoiceSentOn: '2027-03-12', paidOn: '2027-04-02' }),
      deal({ feeMinor: 100_000, goLive: '2027-03-20', invoiceState: 'sent', invoiceSentOn: '2027-03-25' }),
      deal({ feeMinor: 90_000, currency: 'EUR', goLive: '2027-03-01' }),
      deal({ feeMinor: 5_000 }),
    ]);
    expect(rows).toEqual([
      { month: '2027-01', currency: 'USD', bookedMinor: 5_000, invoicedMinor: 0, paidMinor: 0 },
      { month: '2027-03', currency: 'EUR', bookedMinor: 90_000, invoicedMinor: 0, paidMinor: 0 },
      { month: '2027-03', currency: 'USD', bookedMinor: 350_000, invoicedMinor: 350_000, paidMinor: 0 },
      { month: '2027-04', currency: 'USD', bookedMinor: 0, invoicedMinor: 0, paidMinor: 250_000 },
    ]);
  });
  it('is empty without deals', () => {
    expect(pipelineByMonth([])).toEqual([]);
  });
});
