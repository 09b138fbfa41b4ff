// Calendar dates as "YYYY-MM-DD" strings, computed in UTC so no time zone shifts a day.

export function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

/** Payment is due the deal's terms after the invoice went out, or after go-live while no invoice was sent. */
export function derivePaymentDue(input: { goLive: string | null; invoiceSentOn: string | null; termsDays: number }): string | null {
  const from = input.invoiceSentOn ?? input.goLive;
  return from ? addDays(from, input.termsDays) : null;
}

/** Today's date in UTC for an instant. */
export const dayOf = (at: Date): string => at.toISOString().slice(0, 10);
