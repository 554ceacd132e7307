import { describe, expect, it } from 'vitest';
import {
  formatChange,
  formatDate,
  formatDays,
  formatMoney,
  formatMoneyShort,
  formatTimeLeft,
} from '@/lib/runs/format';

// Reference: the en-GB formats of the ICU data that ships with Node and Chromium.
describe('figures as the outcome screens show them', () => {
  it('writes money in the project currency with thousands separators and no decimals', () => {
    expect(formatMoney(5_329_265.4, 'EUR')).toBe('€5,329,265');
    expect(formatMoney(1234.5, 'GBP')).toBe('£1,235');
    expect(formatMoneyShort(5_044_665, 'EUR')).toBe('€5.04m');
  });

  it('writes dates, working days and time left', () => {
    expect(formatDate('2027-11-19')).toBe('19 Nov 2027');
    expect(formatDays(190)).toBe('190.0 wd');
    expect(formatTimeLeft(12_300)).toBe('about 13 s');
    expect(formatTimeLeft(185_000)).toBe('about 3 min');
  });

  it('signs a change, and shows a change that rounds away as 0 (never −0)', () => {
    expect(formatChange(275, (v) => formatMoney(v, 'EUR'))).toBe('+€275');
    expect(formatChange(-923, (v) => formatMoney(v, 'EUR'))).toBe('−€923');
    expect(formatChange(-0.004, (v) => formatDays(v))).toBe('0');
  });
});
