import { describe, expect, it } from 'vitest';
import { addDays, daysBetween, derivePaymentDue } from './dates';
import { formatMoney, isCurrency, minorDigits, minorToInput, parseMoney } from './money';

describe('money', () => {
  it('knows ISO 4217 codes and their minor digits', () => {
    expect(isCurrency('EUR')).toBe(true);
    expect(isCurrency('eur')).toBe(false);
    expect(isCurrency('XYZ')).toBe(false);
    // Source: ISO 4217 minor units: JPY 0, USD 2, BHD 3.
    expect([minorDigits('JPY'), minorDigits('USD'), minorDigits('BHD')]).toEqual([0, 2, 3]);
  });
  it('formats minor units with Intl.NumberFormat', () => {
    expect(formatMoney(250050, 'USD')).toBe('$2,500.50');
    expect(formatMoney(120000, 'JPY')).toBe('¥120,000');
  });
  it('parses form text into minor units and back', () => {
    expect(parseMoney('2,500.5', 'USD')).toBe(250050);
    expect(parseMoney('2500', 'EUR')).toBe(250000);
    expect(parseMoney('1.5', 'JPY')).toBeNull();
    expect(parseMoney('-3', 'USD')).toBeNull();
    expect(parseMoney('abc', 'USD')).toBeNull();
    expect(minorToInput(250050, 'USD')).toBe('2500.50');
    expect(minorToInput(5, 'USD')).toBe('0.05');
    expect(minorToInput(120000, 'JPY')).toBe('120000');
  });
});

describe('dates', () => {
  it('adds days across months and leap days', () => {
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2027-12-31', 30)).toBe('2028-01-30');
    expect(daysBetween('2027-03-01', '2027-03-04')).toBe(3);
  });
  it('derives payment due from the invoice, else go-live, plus terms', () => {
    expect(derivePaymentDue({ goLive: '2027-03-10', invoiceSentOn: null, termsDays: 30 })).toBe('2027-04-09');
    expect(derivePaymentDue({ goLive: '2027-03-10', invoiceSentOn: '2027-03-12', termsDays: 15 })).toBe('2027-03-27');
    expect(derivePaymentDue({ goLive: null, invoiceSentOn: null, termsDays: 30 })).toBeNull();
  });
});
