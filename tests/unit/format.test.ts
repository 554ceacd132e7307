import { describe, expect, it } from 'vitest';
import {
  MINUS,
  formatChange,
  formatCount,
  formatDate,
  formatDateTime,
  formatDays,
  formatInterval,
  formatMoney,
  formatMoneyExact,
  formatMoneyShort,
  formatNumber,
  formatPercent,
  formatSignedPercent,
} from '@/lib/format';

// References: the en-GB number and date formats of the Unicode CLDR data (shipped as ICU with
// Node and Chromium); the minus sign is U+2212 MINUS SIGN of the Unicode standard (Mathematical
// Operators block), which typesetting practice uses for negative figures instead of the hyphen.
describe('one format for every figure', () => {
  it('writes negatives with the true minus sign, never a hyphen', () => {
    expect(MINUS).toBe('\u2212');
    expect(formatNumber(-1234.5)).toBe('\u22121,234.5');
    expect(formatMoney(-950, 'GBP')).toBe('\u2212£950');
    expect(formatMoneyShort(-1_250_000, 'EUR')).toBe('\u2212€1.25m');
    expect(formatMoneyExact(-12.5, 'USD')).toBe('\u2212US$12.50');
    expect(formatDays(-3.25)).toBe('\u22123.3 wd');
    expect(formatMoney(-950, 'GBP')).not.toContain('-');
  });

  it('never shows minus zero: a value that rounds to nothing is unsigned', () => {
    expect(formatMoney(-0.4, 'EUR')).toBe('€0');
    expect(formatNumber(-0.001)).toBe('0');
    expect(formatPercent(-0.00001)).toBe('0.0 %');
    expect(formatSignedPercent(-0.004)).toBe('0 %');
    expect(formatChange(-0.004, (v) => formatDays(v))).toBe('0');
  });

  it('writes percentages in one style: a space before the sign, one decimal by default', () => {
    expect(formatPercent(0.123)).toBe('12.3 %');
    expect(formatPercent(0.3, 0)).toBe('30 %');
    expect(formatPercent(1)).toBe('100.0 %');
    // A share too small for the shown digits is not shown as nothing.
    expect(formatPercent(0.0002)).toBe('< 0.1 %');
    expect(formatSignedPercent(0.12)).toBe('+12 %');
    expect(formatSignedPercent(-0.08)).toBe('\u22128 %');
  });

  it('signs a change and keeps the unit', () => {
    expect(formatChange(275, (v) => formatMoney(v, 'EUR'))).toBe('+€275');
    expect(formatChange(-923, (v) => formatMoney(v, 'EUR'))).toBe('\u2212€923');
  });

  it('writes money in the currency with thousands separators, counts with separators', () => {
    expect(formatMoney(5_329_265.4, 'EUR')).toBe('€5,329,265');
    expect(formatMoney(1234.5, 'gbp')).toBe('£1,235');
    expect(formatCount(12000)).toBe('12,000');
  });

  it('writes dates in one style, calendar days and instants alike, in UTC', () => {
    expect(formatDate('2027-11-19')).toBe('19 Nov 2027');
    expect(formatDate('2027-11-19T23:30:00.000Z')).toBe('19 Nov 2027');
    expect(formatDate(new Date(Date.UTC(2030, 2, 20)))).toBe('20 Mar 2030');
    expect(formatDateTime('2026-12-02T09:05:00Z')).toBe('2 Dec 2026, 09:05 UTC');
  });

  it('shows a collapsed interval once, marked exact', () => {
    expect(formatInterval(0.25, 0.25, (v) => formatPercent(v))).toBe('25.0 % (exact)');
    expect(formatInterval(1000, 1000.2, (v) => formatMoney(v, 'EUR'))).toBe('€1,000 (exact)');
    expect(formatInterval(0.1, 0.2, (v) => formatPercent(v))).toBe('10.0 % – 20.0 %');
  });
});
