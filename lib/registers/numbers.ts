// Reading numbers typed or pasted by people: "1 250 000", "1,250,000.50", "12.5%"; and writing
// them in the grids, through the one format of lib/format.
import { formatNumber as formatPlainNumber } from '@/lib/format';

/** A number from text, null for an empty cell, or the trimmed text itself when it is not a number. */
export function readNumber(input: unknown): number | null | string {
  if (input === null || input === undefined) return null;
  if (typeof input === 'number') return Number.isFinite(input) ? input : String(input);
  const text = String(input).trim();
  if (text === '') return null;
  // The minus sign the grids show (U+2212) reads back as a minus.
  const cleaned = text
    .replace(/\u2212/g, '-')
    .replace(/[\s\u00a0\u202f]/g, '')
    .replace(/,(?=\d{3}(\D|$))/g, '');
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(cleaned)) return text;
  return Number(cleaned);
}

/** A probability from text: "30%" or "30" → 0.3, "0.3" → 0.3. */
export function readProbability(input: unknown): number | null | string {
  if (typeof input === 'string' && input.trim().endsWith('%')) {
    const n = readNumber(input.trim().slice(0, -1));
    return typeof n === 'number' ? n / 100 : n;
  }
  const n = readNumber(input);
  return typeof n === 'number' && n > 1 ? n / 100 : n;
}

/** A grid's money cell: "1,250,000", "−50,000" (the true minus sign, never "−0"). */
export function formatMoney(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return formatPlainNumber(value, digits, digits);
}

export function formatNumber(value: number | null | undefined, maxDigits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return formatPlainNumber(value, maxDigits);
}
