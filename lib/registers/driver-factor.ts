// A driver's factor range, entered either as a percentage change ("−5%", "+20%") or as a factor
// ("0.95", "1.20"): both say the same multiplier, factor = 1 + change / 100. The registers store
// factors; the grid shows the range both ways.

import { createDistribution, type DistSpec } from '@/lib/sim';
import { readNumber } from './numbers';

export const FACTOR_ENTRIES = ['change', 'factor'] as const;
export type FactorEntry = (typeof FACTOR_ENTRIES)[number];

/**
 * A typed cell as a factor. Text ending in % is a percentage change; a bare number is a change
 * when the row is entered as changes, else a factor. Empty is null; other text is returned as is
 * for the schema to name.
 */
export function readFactor(input: unknown, entry: FactorEntry = 'factor'): number | null | string {
  if (input === null || input === undefined) return null;
  if (typeof input === 'number') return entry === 'change' ? 1 + input / 100 : input;
  const text = String(input)
    .trim()
    .replace(/\u2212/g, '-');
  if (text === '') return null;
  if (text.endsWith('%')) {
    const n = readNumber(text.slice(0, -1));
    return typeof n === 'number' ? round(1 + n / 100) : text;
  }
  const n = readNumber(text);
  if (typeof n !== 'number') return String(input).trim();
  return entry === 'change' ? round(1 + n / 100) : n;
}

// Ten significant decimals: 1 + (−5)/100 is 0.95, not 0.9500000000000001.
const round = (v: number) => Math.round(v * 1e10) / 1e10;

/** A factor as a percentage change: 0.95 → "−5%", 1.2 → "+20%", 1 → "0%". */
export function formatChange(factor: number): string {
  const pct = round((factor - 1) * 100);
  const text = Math.abs(pct).toLocaleString('en-GB', { maximumFractionDigits: 2 });
  return pct > 0 ? `+${text}%` : pct < 0 ? `\u2212${text}%` : '0%';
}

/** A factor with two decimals at least: 0.95 → "0.95", 1.2 → "1.20". */
export function formatFactor(factor: number): string {
  return factor.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 4 });
}

/** "−5% … +20%" or "0.95 … 1.20": the range's low and high, the most likely between when given. */
export function formatRange(values: (number | null | undefined)[], as: FactorEntry): string {
  const shown = values.filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  if (!shown.length) return '';
  const f = as === 'change' ? formatChange : formatFactor;
  return shown.map(f).join(' \u2026 ');
}

/** Why a factor distribution is refused (it can go below zero), or null. */
export function factorBelowZero(spec: DistSpec): string | null {
  let low: number;
  try {
    low = createDistribution(spec, { where: '', field: '' }).support[0];
  } catch {
    return null; // the distribution's own cells report their problems
  }
  if (low >= 0) return null;
  const shown = Number.isFinite(low) ? formatFactor(low) : '−∞';
  return `This range lets the factor go below zero (lowest ${shown}): a factor multiplies cost or duration and must stay at 0 or above (a change of −100% at most). Narrow the range${spec.type === 'triangular' || spec.type === 'pert' ? ', or give it as min–max instead of P10–P90' : ''}.`;
}
