import { describe, expect, it } from 'vitest';
import { readNumber, readProbability } from '@/lib/registers/numbers';

// How spreadsheets show and copy figures (common practice): currency signs or codes around the
// figure, commas or spaces between thousands, k/m/bn for thousands, millions and billions,
// brackets for negatives in accounting formats, a trailing % for hundredths, and a leading
// apostrophe that marks a cell as text.
describe('readNumber', () => {
  it.each([
    ['£95,000', 95_000],
    ['€1.2m', 1_200_000],
    ['1 200', 1_200],
    ['1\u00a0250\u202f000', 1_250_000],
    ['1,250,000.50', 1_250_000.5],
    ["'95000", 95_000],
    ["'1,200", 1_200],
    ['$ 40k', 40_000],
    ['EUR 2.5bn', 2_500_000_000],
    ['95,000 GBP', 95_000],
    ['(1,200)', -1_200],
    ['−350', -350],
    ['-£75', -75],
    ['30%', 0.3],
    ['12.5 %', 0.125],
    ['0.07', 0.07],
    ['1e3', 1_000],
  ])('reads %s as %d', (text, value) => {
    expect(readNumber(text)).toBe(value);
  });

  it('keeps an empty cell empty', () => {
    expect(readNumber('')).toBeNull();
    expect(readNumber('   ')).toBeNull();
    expect(readNumber("'")).toBeNull();
    expect(readNumber(null)).toBeNull();
  });

  it.each(['twelve', '1,2,3', '12,34', '1.2.3', '--5', '5m5', '£', 'k', 'EURO 5', '1,2345'])(
    'gives %s back as text, to be refused with a reason',
    (text) => {
      expect(readNumber(text)).toBe(text);
    },
  );

  it('passes numbers through and refuses non-finite ones', () => {
    expect(readNumber(42.5)).toBe(42.5);
    expect(readNumber(Number.NaN)).toBe('NaN');
  });
});

describe('readProbability', () => {
  it.each([
    ['30%', 0.3],
    ["'30%", 0.3],
    ['30', 0.3],
    ['0.3', 0.3],
    ['100%', 1],
    ['0.5%', 0.005],
  ])('reads %s as %d', (text, value) => {
    expect(readProbability(text)).toBeCloseTo(value, 12);
  });

  it('keeps text that is not a number', () => {
    expect(readProbability('likely')).toBe('likely');
  });
});
