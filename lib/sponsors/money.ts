// Fees are integer minor units with an ISO 4217 code; Intl knows each currency's minor digits.

/** Source: ECMA-402, Intl.supportedValuesOf('currency'): the ISO 4217 codes this runtime formats. */
const known = new Set(Intl.supportedValuesOf('currency'));

export function isCurrency(code: string): boolean {
  return /^[A-Z]{3}$/.test(code) && known.has(code);
}

/** 2 for EUR, 0 for JPY, 3 for BHD (Intl's default fraction digits come from ISO 4217). */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

export function formatMoney(minor: number, currency: string, locale = 'en-US'): string {
  const digits = minorDigits(currency);
  return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 10 ** digits);
}

/** "2,500.50" in USD -> 250050; null when it is not an amount with at most the currency's digits. */
export function parseMoney(text: string, currency: string): number | null {
  const t = text.trim().replace(/[,\s]/g, '');
  const digits = minorDigits(currency);
  const m = /^(\d{1,12})(?:\.(\d*))?$/.exec(t);
  if (!m) return null;
  const frac = m[2] ?? '';
  if (frac.length > digits) return null;
  return Number(m[1]) * 10 ** digits + Number(frac.padEnd(digits, '0') || '0');
}

/** 250050 in USD -> "2500.50", for a form field. */
export function minorToInput(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  if (digits === 0) return String(minor);
  const s = String(minor).padStart(digits + 1, '0');
  return `${s.slice(0, -digits)}.${s.slice(-digits)}`;
}
